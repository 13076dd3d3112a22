/**
 * Default question keys: a readable slug of the question text ("How many people live in your
 * household?" → how_many_people_live_in_your_household), valid as an export column name and
 * unique within the questionnaire. Researchers can still type their own key.
 */
import slugify from '@sindresorhus/slugify';

/** What a question key looks like: a lowercase letter, then up to 39 letters, digits or _. */
export const QUESTION_KEY_PATTERN = /^[a-z][a-z0-9_]{0,39}$/;

/** Room left for a "_2"…"_99" suffix within the 40-character key limit. */
const MAX_BASE = 36;

function keyBase(text: string): string {
  const words = slugify(text, { separator: '_', decamelize: false }).split('_').filter(Boolean);
  let key = '';
  for (const w of words) {
    const next = key ? `${key}_${w}` : w;
    if (next.length > MAX_BASE) break;
    key = next;
  }
  if (!key && words.length) key = words[0].slice(0, MAX_BASE);
  if (!key) return 'question';
  return /^[a-z]/.test(key) ? key : `q_${key}`.slice(0, MAX_BASE).replace(/_$/, '');
}

/** The slug of `text`, with _2, _3 … added while it collides with one of `taken`. */
export function questionKeyFromText(text: string, taken: Iterable<string> = []): string {
  const used = new Set(taken);
  const base = keyBase(text);
  if (!used.has(base)) return base;
  for (let n = 2; ; n++) if (!used.has(`${base}_${n}`)) return `${base}_${n}`;
}

/**
 * Whether a key is still the one generated from the question's text (so it may follow the text
 * as it is edited) rather than one the researcher chose.
 */
export function isGeneratedKey(key: string, text: string, taken: Iterable<string>): boolean {
  return key === questionKeyFromText(text, taken);
}
