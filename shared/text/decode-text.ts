/**
 * The text of an uploaded file. Spreadsheet programs on Windows save "CSV" in the system's code
 * page (Windows-1252 in Western Europe) unless told to use UTF-8, and "Unicode text" as UTF-16
 * with a byte-order mark; read as UTF-8, every accented letter of the first would become a
 * replacement character without a word, and the second would not read at all. A file starting
 * with a UTF-16 byte-order mark is read as UTF-16; bytes that are valid UTF-8 as UTF-8 (a
 * byte-order mark dropped); any others as Windows-1252, whose letters cover the Western
 * European languages. A Windows-1252 file with accented letters is practically never valid
 * UTF-8, and a file of plain ASCII reads the same either way (common practice, no source).
 */

/** The UTF-16 encoding a byte-order mark at the start names (FF FE little-, FE FF big-endian). */
export function utf16Of(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return 'utf-16le';
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return 'utf-16be';
  return null;
}

/**
 * Windows-1252's letters for the bytes 0x80–0x9F (WHATWG Encoding Standard, index
 * windows-1252); the five bytes it leaves undefined keep their own code points.
 */
const HIGH = '€\u0081‚ƒ„…†‡ˆ‰Š‹Œ\u008DŽ\u008F\u0090‘’“”•–—˜™š›œ\u009DžŸ';

/** Windows-1252 bytes as text; one byte is one letter, so any slice of a file decodes alone. */
export function decodeWindows1252(bytes: Uint8Array): string {
  // Node's decoder (20.x) reads 0x80–0x9F as Latin-1 control characters, where browsers follow
  // the standard; both then agree once those are mapped as the standard's index maps them.
  return new TextDecoder('windows-1252')
    .decode(bytes)
    .replace(/[\u0080-\u009f]/g, (c) => HIGH[c.charCodeAt(0) - 0x80]);
}

export function decodeText(bytes: Uint8Array): string {
  const utf16 = utf16Of(bytes);
  // The decoder drops the byte-order mark itself.
  if (utf16) return new TextDecoder(utf16).decode(bytes);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return decodeWindows1252(bytes);
  }
}
