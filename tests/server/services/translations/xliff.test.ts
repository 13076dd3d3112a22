import { describe, expect, it } from 'vitest';
import { readXliff, writeXliff, XLIFF_NS } from '../../../../server/services/translations/xliff';

const doc = {
  srcLang: 'en',
  trgLang: 'ar',
  fileId: 'study-1',
  units: [
    {
      id: 'study.title',
      note: 'Survey title',
      source: 'Water & you <2026>',
      target: 'المياه وأنت',
    },
    { id: 'page.p1.body', note: '', source: 'Line one\n\nLine "two" 💧', target: '' },
  ],
};

describe('XLIFF 2.0 (OASIS 2014 core)', () => {
  it('writes a document that reads back to the same units, markup characters included', () => {
    const xml = writeXliff(doc);
    expect(xml).toContain(`<xliff xmlns="${XLIFF_NS}" version="2.0" srcLang="en" trgLang="ar">`);
    expect(xml).toContain('Water &amp; you &lt;2026&gt;');
    const read = readXliff(xml);
    expect({ ...read, units: read.units.map(({ line: _line, ...u }) => u) }).toEqual(doc);
    // Each unit keeps the line its start tag is on, so refusals can say where to look.
    expect(read.units.map((u) => u.line)).toEqual([4, 11]);
  });

  it('reads CDATA and drops inline tags, keeping their text', () => {
    const xml = `<xliff xmlns="${XLIFF_NS}" version="2.0" srcLang="en" trgLang="de"><file id="f">
      <unit id="k"><segment><source>A</source><target><![CDATA[B & C]]> <pc id="1">D</pc></target></segment></unit>
    </file></xliff>`;
    expect(readXliff(xml).units[0].target).toBe('B & C D');
  });

  it('refuses any DOCTYPE: external entities (XXE) and entity expansion are never read', () => {
    const xxe = `<?xml version="1.0"?><!DOCTYPE x [<!ENTITY e SYSTEM "file:///etc/passwd">]>
      <xliff xmlns="${XLIFF_NS}" version="2.0" srcLang="en" trgLang="de"><file id="f">
      <unit id="k"><segment><source>&e;</source></segment></unit></file></xliff>`;
    expect(() => readXliff(xxe)).toThrow(/DOCTYPE/);
    const laughs = `<?xml version="1.0"?><!DOCTYPE l [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]>
      <xliff xmlns="${XLIFF_NS}" version="2.0" srcLang="en" trgLang="de"><file id="f"/></xliff>`;
    expect(() => readXliff(laughs)).toThrow(/DOCTYPE/);
  });

  it('refuses files that are not XLIFF 2.0 or not well-formed', () => {
    expect(() => readXliff('<xliff version="1.2"><file/></xliff>')).toThrow(/not XLIFF 2.0/);
    expect(() =>
      readXliff(`<xliff xmlns="${XLIFF_NS}" version="2.1" srcLang="en"><file id="f"/></xliff>`),
    ).toThrow(/version 2.0/);
    expect(() => readXliff(`<xliff xmlns="${XLIFF_NS}" version="2.0"><file id="f">`)).toThrow(
      /well-formed/,
    );
    expect(() =>
      readXliff(
        `<xliff xmlns="${XLIFF_NS}" version="2.0" srcLang="en"><file id="a"/><file id="b"/></xliff>`,
      ),
    ).toThrow(/exactly one <file>/);
  });
});
