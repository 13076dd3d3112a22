/**
 * XLIFF 2.0 (OASIS XLIFF Version 2.0, 2014, core: <xliff version srcLang trgLang><file id>
 * <unit id><segment><source/><target/></segment></unit></file></xliff>) for a study's texts:
 * one <file> per study (id = the study id), one <unit> per text key, notes saying where the
 * respondent meets the text. Read with saxes, a non-validating streaming parser that never
 * fetches anything; any DOCTYPE is refused, so no entity can be declared (no XXE, no entity
 * expansion), and only XML's five predefined entities and character references are read.
 */
import { SaxesParser } from 'saxes';

export const XLIFF_NS = 'urn:oasis:names:tc:xliff:document:2.0';

export type XliffUnit = {
  id: string;
  note: string;
  source: string;
  target: string;
  /** Line of the <unit> start tag (reading only), for refusals that name where to look. */
  line?: number;
};
export type XliffDocument = {
  srcLang: string;
  trgLang: string;
  fileId: string;
  units: XliffUnit[];
};

/** Characters XML 1.0 cannot carry at all are dropped; markup characters are escaped. */
function escapeXml(text: string): string {
  return text
    .replace(/[^\t\n\r\u0020-\uD7FF\uE000-\uFFFD\u{10000}-\u{10FFFF}]/gu, '')
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;');
}

export function writeXliff(doc: XliffDocument): string {
  const a = (v: string) => `"${escapeXml(v)}"`;
  const units = doc.units.map(
    (u) =>
      `    <unit id=${a(u.id)}>\n` +
      (u.note ? `      <notes><note>${escapeXml(u.note)}</note></notes>\n` : '') +
      `      <segment>\n        <source>${escapeXml(u.source)}</source>\n` +
      `        <target>${escapeXml(u.target)}</target>\n      </segment>\n    </unit>\n`,
  );
  return (
    `<?xml version="1.0" encoding="UTF-8"?>\n` +
    `<xliff xmlns=${a(XLIFF_NS)} version="2.0" srcLang=${a(doc.srcLang)} trgLang=${a(doc.trgLang)}>\n` +
    `  <file id=${a(doc.fileId)}>\n${units.join('')}  </file>\n</xliff>\n`
  );
}

export class XliffError extends Error {
  constructor(
    message: string,
    readonly line?: number,
  ) {
    super(message);
  }
}

/**
 * Reads an XLIFF 2.0 document into its units. Inline markup inside <source>/<target> (<ph/>,
 * <pc>…) is not produced by writeXliff; its text content is kept and the tags dropped.
 */
export function readXliff(xml: string): XliffDocument {
  const parser = new SaxesParser({ xmlns: true, position: true });
  const doc: XliffDocument = { srcLang: '', trgLang: '', fileId: '', units: [] };
  const stack: string[] = [];
  let unit: XliffUnit | null = null;
  let files = 0;
  let text: 'source' | 'target' | 'note' | null = null;
  let failure: XliffError | null = null;
  const fail = (message: string) => {
    failure ??= new XliffError(message, parser.line);
  };
  parser.on('doctype', () => fail('The file declares a DOCTYPE; translation files must not.'));
  parser.on('error', (e) => fail(`Not well-formed XML: ${e.message}`));
  parser.on('opentag', (tag) => {
    const name = tag.local;
    if (stack.length === 0) {
      if (name !== 'xliff' || tag.uri !== XLIFF_NS)
        fail('The file is not XLIFF 2.0 (its root must be <xliff> in the XLIFF 2.0 namespace).');
      else if (tag.attributes.version?.value !== '2.0') fail('Only XLIFF version 2.0 is read.');
      doc.srcLang = tag.attributes.srcLang?.value ?? '';
      doc.trgLang = tag.attributes.trgLang?.value ?? '';
    }
    if (name === 'file' && ++files === 1) doc.fileId = tag.attributes.id?.value ?? '';
    if (name === 'unit') {
      const id = tag.attributes.id?.value ?? '';
      unit = { id, note: '', source: '', target: '', line: parser.line };
      if (!unit.id) fail('A <unit> has no id.');
    }
    if (unit && (name === 'source' || name === 'target' || name === 'note')) text = name;
    stack.push(name);
  });
  const onText = (t: string) => {
    if (unit && text) unit[text] += t;
  };
  parser.on('text', onText);
  parser.on('cdata', onText);
  parser.on('closetag', (tag) => {
    stack.pop();
    if (tag.local === text) text = null;
    if (tag.local === 'unit' && unit) {
      doc.units.push(unit);
      unit = null;
    }
  });
  try {
    parser.write(xml).close();
  } catch (err) {
    fail(`Not well-formed XML: ${(err as Error).message}`);
  }
  if (failure) throw failure;
  if (files !== 1) throw new XliffError('The file must hold exactly one <file> (one study).');
  return doc;
}
