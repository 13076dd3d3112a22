/**
 * Invitation and reminder e-mails to a study's invitees, as plain text and HTML. Every one
 * carries the personal link and the unsubscribe link, in the body and in the List-Unsubscribe
 * headers (RFC 2369, and the one-click POST of RFC 8058, which the public unsubscribe API
 * accepts). The words come from shared/mail/invitation-wording.ts, which the send panel uses
 * for its preview.
 */
import escapeHtml from 'escape-html';
import type { OutgoingMail } from './mailer';
import { composeMailWording, type MailKind } from '../../shared/mail/invitation-wording';

export type FieldworkMailInput = {
  kind: MailKind;
  to: string;
  name: string;
  /** The title respondents see, not the internal study name. */
  studyTitle: string;
  /** How long the consent page says the survey takes, or null. */
  duration: string | null;
  surveyLink: string;
  unsubscribeLink: string;
  /** One-click endpoint (API) for mail clients; the page link is for people. */
  unsubscribeApi: string;
  subject?: string;
  message?: string;
  /** Per study: the name the e-mail comes from and the address replies go to. */
  senderName?: string | null;
  replyTo?: string | null;
};

const notForwarding = 'This link is for you alone; please do not forward it.';
const unsubscribeWords = 'No more e-mails about this survey';

/** Paragraphs of the message: a blank line starts a new one, as in the editor. */
const paragraphs = (text: string) =>
  text
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter(Boolean);

export function fieldworkMail(p: FieldworkMailInput): OutgoingMail {
  const w = composeMailWording({
    kind: p.kind,
    name: p.name,
    study: p.studyTitle,
    duration: p.duration,
    subject: p.subject,
    message: p.message,
  });
  const text =
    `${w.greeting}\n\n${w.message}\n\n` +
    `Your personal link: ${p.surveyLink}\n\n${notForwarding}\n\n` +
    `--\n${unsubscribeWords}: ${p.unsubscribeLink}\n`;
  const link = (href: string, label: string) =>
    `<a href="${escapeHtml(href)}">${escapeHtml(label)}</a>`;
  const html =
    `<!doctype html><html><body style="font-family:sans-serif;line-height:1.5;color:#14213d">` +
    `<p>${escapeHtml(w.greeting)}</p>` +
    paragraphs(w.message)
      .map((para) => `<p>${escapeHtml(para).replace(/\n/g, '<br>')}</p>`)
      .join('') +
    `<p>${link(p.surveyLink, 'Open your personal survey link')}</p>` +
    `<p>${escapeHtml(notForwarding)}</p>` +
    `<hr><p style="font-size:small">${link(p.unsubscribeLink, unsubscribeWords)}</p>` +
    `</body></html>`;
  return {
    to: p.to,
    subject: w.subject,
    text,
    html,
    ...(p.senderName ? { fromName: p.senderName } : {}),
    ...(p.replyTo ? { replyTo: p.replyTo } : {}),
    headers: {
      'List-Unsubscribe': `<${p.unsubscribeApi}>, <${p.unsubscribeLink}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  };
}
