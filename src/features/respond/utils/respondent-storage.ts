/**
 * What the respondent's browser keeps between visits, per survey: the session token and the
 * outbox of answers not yet acknowledged by the server. localStorage survives reloads, closed
 * tabs and a dropped connection; if it is unavailable (private mode quirks) memory is used.
 */
import type { AnswerValue, SubmitAnswerInput } from '@shared/schemas/respondent';

/** An answer to send; `revise` marks a changed earlier answer (sent to the revisions route). */
export type OutboxItem = { token: string; answer: SubmitAnswerInput; revise?: boolean };

const memory = new Map<string, string>();

function read(key: string): string | null {
  try {
    return window.localStorage.getItem(key);
  } catch {
    return memory.get(key) ?? null;
  }
}

function write(key: string, value: string | null): void {
  try {
    if (value === null) window.localStorage.removeItem(key);
    else window.localStorage.setItem(key, value);
  } catch {
    if (value === null) memory.delete(key);
    else memory.set(key, value);
  }
}

const tokenKey = (publicId: string) => `cw:respond:${publicId}:token`;
const outboxKey = (publicId: string) => `cw:respond:${publicId}:outbox`;
const givenKey = (publicId: string) => `cw:respond:${publicId}:given`;

export function readToken(publicId: string): string | null {
  return read(tokenKey(publicId));
}

export function saveToken(publicId: string, token: string): void {
  write(tokenKey(publicId), token);
}

export function readOutbox(publicId: string): OutboxItem[] {
  try {
    const parsed = JSON.parse(read(outboxKey(publicId)) ?? '[]');
    return Array.isArray(parsed) ? (parsed as OutboxItem[]) : [];
  } catch {
    return [];
  }
}

function writeOutbox(publicId: string, items: OutboxItem[]): void {
  write(outboxKey(publicId), items.length ? JSON.stringify(items) : null);
}

const sameScreen = (a: OutboxItem, b: OutboxItem) =>
  a.token === b.token && a.answer.screenKey === b.answer.screenKey;

/** Adds an answer; a second answer for the same screen is ignored (the first one stands). */
export function enqueueAnswer(publicId: string, item: OutboxItem): void {
  const items = readOutbox(publicId);
  if (items.some((i) => sameScreen(i, item))) return;
  writeOutbox(publicId, [...items, item]);
}

/**
 * Queues a changed answer. If the first answer for that screen has not been sent yet, it is
 * changed in place (the server never needs to see it); an unsent earlier change is dropped.
 */
export function enqueueRevision(publicId: string, item: OutboxItem): void {
  const items = readOutbox(publicId);
  const unsent = items.findIndex((i) => sameScreen(i, item) && !i.revise);
  if (unsent >= 0) {
    items[unsent] = { token: item.token, answer: item.answer };
    writeOutbox(publicId, items);
    return;
  }
  const rest = items.filter((i) => !(sameScreen(i, item) && i.revise));
  writeOutbox(publicId, [...rest, { ...item, revise: true }]);
}

/** The answers this browser gave in a session, by screen: Back shows them again. */
export function readGiven(publicId: string, token: string): Record<string, AnswerValue> {
  try {
    const parsed = JSON.parse(read(givenKey(publicId)) ?? 'null') as {
      token: string;
      values: Record<string, AnswerValue>;
    } | null;
    return parsed?.token === token ? parsed.values : {};
  } catch {
    return {};
  }
}

export function saveGiven(publicId: string, token: string, values: Record<string, AnswerValue>) {
  write(givenKey(publicId), JSON.stringify({ token, values }));
}

export function removeAnswer(publicId: string, clientId: string): void {
  writeOutbox(
    publicId,
    readOutbox(publicId).filter((i) => i.answer.clientId !== clientId),
  );
}

/** Keeps only the answers of `token` (a new session drops another session's leftovers). */
export function keepOutboxOf(publicId: string, token: string | null): OutboxItem[] {
  const items = readOutbox(publicId).filter((i) => i.token === token);
  writeOutbox(publicId, items);
  return items;
}

/** Delay before retry n (0-based): 1 s doubling to 30 s, with jitter so phones do not align. */
export function retryDelayMs(attempt: number): number {
  const base = Math.min(30_000, 1000 * 2 ** attempt);
  return Math.round(base * (0.8 + Math.random() * 0.4));
}

export function newClientId(): string {
  // randomUUID needs a secure context; plain-http pages fall back to 128 random bits.
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  const bytes = crypto.getRandomValues(new Uint8Array(16));
  return Array.from(bytes, (b: number) => b.toString(16).padStart(2, '0')).join('');
}
