/**
 * Invitation and reminder e-mails to a study's invitees. Every one carries the personal link
 * and the unsubscribe link, in the body and in the List-Unsubscribe headers (RFC 2369, and the
 * one-click POST of RFC 8058, which the public unsubscribe API accepts).
 */
import type { OutgoingMail } from './mailer';

export type FieldworkMailInput = {
  to: string;
  name: string;
  studyName: string;
  surveyLink: string;
  unsubscribeLink: string;
  /** One-click endpoint (API) for mail clients; the page link is for people. */
  unsubscribeApi: string;
  subject?: string;
  message?: string;
};

const greeting = (name: string) => (name ? `Dear ${name},` : 'Hello,');

function withLinks(p: FieldworkMailInput, subject: string, intro: string): OutgoingMail {
  const text =
    `${greeting(p.name)}\n\n${intro}\n\n` +
    `Your personal link: ${p.surveyLink}\n\n` +
    `This link is for you alone; please do not forward it.\n\n` +
    `--\nNo more e-mails about this survey: ${p.unsubscribeLink}\n`;
  return {
    to: p.to,
    subject,
    text,
    headers: {
      'List-Unsubscribe': `<${p.unsubscribeApi}>, <${p.unsubscribeLink}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  };
}

export function studyInvitationMail(p: FieldworkMailInput): OutgoingMail {
  return withLinks(
    p,
    p.subject ?? `Invitation: ${p.studyName}`,
    p.message ??
      `You are invited to take part in the survey "${p.studyName}". It takes about ten minutes ` +
        `and works on a phone or a computer. Taking part is voluntary; the first page explains ` +
        `how your answers are used.`,
  );
}

export function studyReminderMail(p: FieldworkMailInput): OutgoingMail {
  return withLinks(
    p,
    p.subject ?? `Reminder: ${p.studyName}`,
    p.message ??
      `A short reminder about the survey "${p.studyName}". If you have already started, the ` +
        `link takes you back to where you stopped.`,
  );
}
