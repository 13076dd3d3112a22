/** E-mails of sign-up: the confirmation link, and the notice when the address already has an account. */
import type { OutgoingMail } from './mailer';

export function confirmEmailMail(p: { to: string; link: string; hours: number }): OutgoingMail {
  return {
    to: p.to,
    subject: 'Confirm your e-mail address for Choicewright',
    text:
      `Someone (hopefully you) created a Choicewright account with this address.\n\n` +
      `Confirm the address and sign in: ${p.link}\n\nThe link works once and expires in ${p.hours} hours. ` +
      `If you did not sign up, ignore this e-mail; the account stays unusable.`,
  };
}

export function accountExistsMail(p: {
  to: string;
  signInLink: string;
  resetLink: string;
}): OutgoingMail {
  return {
    to: p.to,
    subject: 'You already have a Choicewright account',
    text:
      `Someone (hopefully you) tried to create a Choicewright account with this address, which ` +
      `already has one. Nothing was changed.\n\nSign in: ${p.signInLink}\n` +
      `Forgot your password? ${p.resetLink}\n\nIf this was not you, you can ignore this e-mail.`,
  };
}
