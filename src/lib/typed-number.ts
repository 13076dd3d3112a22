/**
 * A number as a person types it into a text field: spaces around it dropped, and a decimal comma
 * read as a point, since phone keyboards and desktop users in comma-decimal locales write "2,5"
 * (common practice, no source). Empty text is null; anything else that is not a finite number
 * is NaN, for the caller to refuse with a message.
 */
export function readTypedNumber(text: string): number | null {
  const trimmed = text.trim();
  if (trimmed === '') return null;
  const n = Number(trimmed.replace(',', '.'));
  return Number.isFinite(n) ? n : NaN;
}
