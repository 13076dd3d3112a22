/**
 * Uploaded text (shared/text/decode-text.ts): UTF-8 when the bytes are UTF-8, else Windows-1252.
 * The byte values are those of the encodings' own tables (the WHATWG Encoding Standard's
 * windows-1252 index: 0xE4 ä, 0xFC ü, 0xE9 é, 0x80 €).
 */
import { describe, expect, it } from 'vitest';
import { decodeText } from '../../../shared/text/decode-text';

const bytes = (...values: number[]) => new Uint8Array(values);

describe('decodeText', () => {
  it('reads UTF-8 as UTF-8, dropping a byte-order mark', () => {
    const text = 'name;note\nMüller;Café 5 €\n';
    expect(decodeText(new TextEncoder().encode(text))).toBe(text);
    expect(decodeText(new Uint8Array([0xef, 0xbb, 0xbf, ...new TextEncoder().encode(text)]))).toBe(
      text,
    );
  });

  it('reads bytes that are not UTF-8 as Windows-1252', () => {
    // "Müller;Café 5 €" as a Windows spreadsheet saves it.
    const cp1252 = bytes(
      0x4d,
      0xfc,
      0x6c,
      0x6c,
      0x65,
      0x72,
      0x3b,
      0x43,
      0x61,
      0x66,
      0xe9,
      0x20,
      0x35,
      0x20,
      0x80,
    );
    expect(decodeText(cp1252)).toBe('Müller;Café 5 €');
  });

  it('reads the bytes 0x80–0x9F as the index of the standard does (unlike Node’s own decoder)', () => {
    // Curly quotes, dashes, the euro sign and the ellipsis that word processors put into text.
    expect(decodeText(bytes(0x93, 0x61, 0x94, 0x20, 0x96, 0x20, 0x97, 0x20, 0x80, 0x85))).toBe(
      '“a” – — €…',
    );
    // The five bytes the index leaves undefined keep their own code points.
    expect(decodeText(bytes(0x81, 0x8d, 0x8f, 0x90, 0x9d))).toBe('\u0081\u008d\u008f\u0090\u009d');
  });

  it('reads a file with a UTF-16 byte-order mark as UTF-16, either byte order', () => {
    // "Unicode text" as a spreadsheet saves it: FF FE, then UTF-16LE (Unicode 15.0, ch. 3.10).
    const text = 'name\tnote\nŁucja\tGewässer 💧\n';
    const le = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    expect(decodeText(le)).toBe(text);
    const be = Buffer.from(le);
    for (let i = 0; i < be.length; i += 2) [be[i], be[i + 1]] = [be[i + 1], be[i]];
    expect(decodeText(be)).toBe(text);
  });

  it('reads plain ASCII the same either way', () => {
    expect(decodeText(bytes(0x61, 0x2c, 0x62, 0x0a))).toBe('a,b\n');
  });
});
