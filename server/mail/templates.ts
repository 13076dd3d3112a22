/** Plain, short e-mails for account events. Links point at APP_URL. */
import type { OutgoingMail } from './mailer';

export function teamInvitationMail(p: {
  to: string;
  teamName: string;
  inviter: string;
  role: string;
  link: string;
  days: number;
}): OutgoingMail {
  return {
    to: p.to,
    subject: `${p.inviter} invited you to ${p.teamName} on Choicewright`,
    text:
      `${p.inviter} invited you to join the team "${p.teamName}" on Choicewright as ${p.role}.\n\n` +
      `Accept the invitation: ${p.link}\n\nThe link works once and expires in ${p.days} days. ` +
      `If you did not expect this e-mail you can ignore it.`,
  };
}

export function passwordResetMail(p: { to: string; link: string; minutes: number }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Reset your Choicewright password',
    text:
      `Someone (hopefully you) asked to reset the password of this Choicewright account.\n\n` +
      `Choose a new password: ${p.link}\n\nThe link works once and expires in ${p.minutes} minutes. ` +
      `If you did not ask for this, ignore this e-mail; your password stays as it is.`,
  };
}
