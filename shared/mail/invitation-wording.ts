/**
 * The words of invitation and reminder e-mails, shared by the server (which sends them) and
 * the send panel (which previews them): placeholders, the default wording, and the stated
 * duration, read from the consent page so the e-mail never promises a different length than
 * the survey itself does.
 */
import type { z } from 'zod';

export const mailPlaceholders = {
  name: "the invitee's name (empty when the list has none)",
  study: 'the title respondents see',
  duration: 'how long the consent page says the survey takes',
} as const;
export type MailPlaceholder = keyof typeof mailPlaceholders;
export type MailKind = 'invitation' | 'reminder';

const placeholderPattern = /\{([^{}\s]*)\}/g;

/** Placeholders in the text that do not exist, each once, in order of appearance. */
export function unknownPlaceholders(text: string): string[] {
  const found = [...text.matchAll(placeholderPattern)].map((m) => m[1]);
  return [...new Set(found.filter((p) => !(p in mailPlaceholders)))];
}

export function unknownPlaceholderMessage(text: string): string | null {
  const unknown = unknownPlaceholders(text);
  if (unknown.length === 0) return null;
  const known = Object.keys(mailPlaceholders).map((k) => `{${k}}`);
  const list = unknown.map((p) => `{${p}}`).join(', ');
  return `${unknown.length === 1 ? 'There is no placeholder' : 'There are no placeholders'} ${list}: use ${known.slice(0, -1).join(', ')} or ${known[known.length - 1]}`;
}

/** A zod refinement for wording fields: refuses a placeholder that does not exist, by name. */
export function knownPlaceholdersOnly(text: string, ctx: z.RefinementCtx): void {
  const message = unknownPlaceholderMessage(text);
  if (message) ctx.addIssue({ code: 'custom', message });
}

export function fillPlaceholders(text: string, values: Record<MailPlaceholder, string>): string {
  return text.replace(placeholderPattern, (whole, key: string) =>
    key in values ? values[key as MailPlaceholder] : whole,
  );
}

/**
 * "about 10 minutes" or "10 to 15 minutes", as the consent text states it, or null when it
 * names no number of minutes.
 */
export function statedDuration(consentBody: string): string | null {
  const m = consentBody.match(/(\d{1,3})(?:\s*(?:to|–|-)\s*(\d{1,3}))?\s*min(?:ute)?s?\b/i);
  if (!m) return null;
  return m[2] ? `${m[1]} to ${m[2]} minutes` : `about ${m[1]} minute${m[1] === '1' ? '' : 's'}`;
}

export function defaultSubject(kind: MailKind): string {
  return kind === 'invitation' ? 'Invitation: {study}' : 'Reminder: {study}';
}

/** The default message; the duration sentence is left out when the consent page names none. */
export function defaultMessage(kind: MailKind, duration: string | null): string {
  if (kind === 'reminder')
    return 'A short reminder about the survey "{study}". If you have already started, the link takes you back to where you stopped.';
  const length = duration ? ' It takes {duration} and works on a phone or a computer.' : '';
  return `You are invited to take part in the survey "{study}".${length} Taking part is voluntary; the first page explains how your answers are used.`;
}

export type MailWordingInput = {
  kind: MailKind;
  name: string;
  study: string;
  /** From the consent page (statedDuration); null leaves the sentence out of the default. */
  duration: string | null;
  subject?: string;
  message?: string;
};

/** Subject, greeting and message with every placeholder filled. */
export function composeMailWording(p: MailWordingInput) {
  const values = { name: p.name, study: p.study, duration: p.duration ?? '' };
  return {
    subject: fillPlaceholders(p.subject ?? defaultSubject(p.kind), values),
    greeting: p.name ? `Dear ${p.name},` : 'Hello,',
    message: fillPlaceholders(p.message ?? defaultMessage(p.kind, p.duration), values),
  };
}
