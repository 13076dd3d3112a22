/**
 * What respondents read for a level. Numeric levels are written from their value and unit
 * (shared/format.ts: money through Intl's currency style, other units after the number) unless the researcher typed an
 * override. An override that no longer shows its coded value is a data-integrity problem:
 * respondents would see one number while the model codes another. The editor flags it and
 * the go-live check refuses it unless the researcher confirmed that label for that value.
 */
import type { Attribute, Level } from '../schemas/study-definition';
import { formatAmount } from '../format';

/**
 * The label a numeric level gets from its value and unit: the product's one amount format
 * (shared/format.ts), at most two decimals and no trailing zeros ("€15", "−€3", "2.5 km").
 */
export function formatNumericLevel(value: number, unit?: string): string {
  return formatAmount(value, unit, 2, true);
}

type LabelledAttribute = Pick<Attribute, 'kind' | 'unit'>;

/** True when a numeric level carries a label of its own instead of the derived one. */
export function hasLabelOverride(attribute: LabelledAttribute, level: Level): boolean {
  return attribute.kind === 'numeric' && level.label.trim() !== '';
}

/** The text respondents see for a level (and every screen and file names it by). */
export function getLevelLabel(attribute: LabelledAttribute, level: Level): string {
  const own = level.label.trim();
  if (own) return own;
  if (attribute.kind === 'numeric' && level.value !== undefined)
    return formatNumericLevel(level.value, attribute.unit);
  return '';
}

// A number as people write it: a sign only where it cannot be a range dash ("4–6"), an
// optional currency symbol, digits with group separators (comma, dot, space, thin or no-break
// space) or one decimal mark.
const NUMBER_PATTERN =
  /(?<![\d\p{L}])([−–-])?\s?(?:[€$£¥]|CHF|kr)?\s?(\d{1,3}(?:[,.\s\u00a0\u202f]\d{3})+(?:[.,]\d+)?|\d+(?:[.,]\d+)?)/gu;

/** The values a digit string can mean: "1,000" is 1000 or 1.0, "2,5" is 2.5, "1.250,5" is 1250.5. */
function readDigits(raw: string): number[] {
  const digits = raw.replace(/[\s\u00a0\u202f]/g, '');
  const marks = digits.replace(/\d/g, '');
  if (marks === '') return [Number(digits)];
  const last = marks[marks.length - 1];
  const lastAt = digits.lastIndexOf(last);
  const asDecimal = Number(
    digits.slice(0, lastAt).replace(/[.,]/g, '') + '.' + digits.slice(lastAt + 1),
  );
  const grouped = Number(digits.replace(/[.,]/g, ''));
  // One kind of mark, used once, three digits after it: group mark or decimal mark.
  if (new Set(marks).size === 1 && marks.length === 1 && digits.length - lastAt - 1 === 3)
    return [asDecimal, grouped];
  // One kind of mark used several times: group marks. Two kinds: the last one is decimal.
  return new Set(marks).size === 1 && marks.length > 1 ? [grouped] : [asDecimal];
}

/** Every value the numbers written in `text` can stand for. */
export function readNumbersInLabel(text: string): number[] {
  const out: number[] = [];
  for (const match of text.matchAll(NUMBER_PATTERN)) {
    const sign = match[1] ? -1 : 1;
    for (const v of readDigits(match[2])) if (Number.isFinite(v)) out.push(sign * v);
  }
  return out;
}

/** True when the label writes the value (in any usual number format). */
export function labelShowsValue(label: string, value: number): boolean {
  const tolerance = 1e-9 * Math.max(1, Math.abs(value));
  return readNumbersInLabel(label).some((v) => Math.abs(v - value) <= tolerance);
}

/**
 * - `derived`: no override, the label follows value and unit;
 * - `shows_value`: an override that writes the coded value;
 * - `confirmed`: an override without the value that the researcher confirmed for this value;
 * - `drifted`: an override without the value, not confirmed — respondents and model disagree.
 * Categorical levels are always `derived` (their label is the level).
 */
export type LevelLabelCheck = 'derived' | 'shows_value' | 'confirmed' | 'drifted';

export function checkLevelLabel(attribute: LabelledAttribute, level: Level): LevelLabelCheck {
  if (!hasLabelOverride(attribute, level) || level.value === undefined) return 'derived';
  const label = level.label.trim();
  if (labelShowsValue(label, level.value)) return 'shows_value';
  const confirmed = level.labelConfirmed;
  if (confirmed && confirmed.value === level.value && confirmed.label.trim() === label)
    return 'confirmed';
  return 'drifted';
}
