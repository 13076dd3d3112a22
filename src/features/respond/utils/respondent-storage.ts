/**
 * What the respondent's browser keeps between visits, per survey: the session token, the
 * outbox of answers not yet acknowledged by the server, and the answers the server refused
 * (with its reason, so the app can say what was not saved and why). localStorage survives
 * reloads, closed tabs and a dropped connection; if it is unavailable (private mode quirks)
 * memory is used.
 */
import type { AnswerValue, SubmitAnswerInput } from '@shared/schemas/respondent';

/**
 * An answer to send. `givenAt`: this device's clock when the answer was given (its age goes
 * with each send); `revise` marks a changed earlier answer (sent to the revisions route).
 */
export type OutboxItem = {
  token: string;
  answer: SubmitAnswerInput;
  givenAt?: number;
  revise?: boolean;
};
export type UnsentAnswer = { screenKey: string; reason: string };

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
const unsentKey = (publicId: string) => `cw:respond:${publicId}:unsent`;
const givenKey = (publicId: string) => `cw:respond:${publicId}:given`;

export function readToken(publicId: string): string | null {
  return read(tokenKey(publicId));
}

export function saveToken(publicId: string, token: string): void {
  write(tokenKey(publicId), token);
}

/** A stored list; empty when nothing is stored or what is stored is not a JSON list. */
function readList<T>(key: string): T[] {
  try {
    const parsed = JSON.parse(read(key) ?? '[]');
    return Array.isArray(parsed) ? (parsed as T[]) : [];
  } catch {
    return [];
  }
}

export function readOutbox(publicId: string): OutboxItem[] {
  return readList<OutboxItem>(outboxKey(publicId));
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
 * Queues a changed answer behind everything before it, so the server sees the first answer,
 * then each change in order, and keeps each replaced one in its history with its times.
 */
export function enqueueRevision(publicId: string, item: OutboxItem): void {
  writeOutbox(publicId, [...readOutbox(publicId), { ...item, revise: true }]);
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

/** The answer as sent now: with how long ago it was given, by this device's clock. */
export function answerToSend(item: OutboxItem): SubmitAnswerInput {
  if (item.givenAt === undefined) return item.answer;
  return { ...item.answer, ageMs: Math.max(0, Math.round(Date.now() - item.givenAt)) };
}

export function readUnsent(publicId: string): UnsentAnswer[] {
  return readList<UnsentAnswer>(unsentKey(publicId));
}

/** Moves a refused answer out of the outbox into the list the app shows, with the reason. */
export function markUnsent(publicId: string, item: OutboxItem, reason: string): UnsentAnswer[] {
  const unsent = [...readUnsent(publicId), { screenKey: item.answer.screenKey, reason }];
  write(unsentKey(publicId), JSON.stringify(unsent));
  removeAnswer(publicId, item.answer.clientId);
  return unsent;
}

/**
 * Keeps only the answers of `token`. Another session's leftovers cannot be stored any more
 * (that session is gone); they move to the unsent list with `reason` rather than vanish.
 */
export function keepOutboxOf(publicId: string, token: string, reason: string): OutboxItem[] {
  const all = readOutbox(publicId);
  for (const other of all.filter((i) => i.token !== token)) markUnsent(publicId, other, reason);
  return all.filter((i) => i.token === token);
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
