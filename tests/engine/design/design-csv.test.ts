/**
 * Design CSV export and import (layout defined in export-design-csv.ts).
 */
import { describe, expect, it } from 'vitest';
import { exportDesignCsv } from '../../../server/engine/design/export-design-csv';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { importDesignCsv } from '../../../server/engine/design/import-design-csv';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';

const definition = makeStudyDefinition({
  excludedCombinations: [
    {
      id: 'p1',
      kind: 'pair',
      a: { attributeId: 'bill', levelId: 'b0' },
      b: { attributeId: 'river', levelId: 'good' },
    },
  ],
});
const HEADER =
  'block,task,alternative,Monthly bill increase,Supply interruptions per year,Taste/odour warning days,River health,Renewable pumping energy';

describe('exportDesignCsv', () => {
  it('writes one row per alternative with values for numeric and labels for categorical', () => {
    const csv = exportDesignCsv(definition, {
      blocks: 1,
      tasks: [
        {
          block: 1,
          task: 1,
          alternatives: [
            { levels: { bill: 'b3', interrupt: 'i2', warn: 'w0', river: 'fair', renew: 'r80' } },
            { levels: { bill: 'b10', interrupt: 'i1', warn: 'w6', river: 'poor', renew: 'r20' } },
          ],
        },
      ],
    });
    expect(csv.trim().split('\n')).toEqual([HEADER, '1,1,1,3,2,0,fair,80', '1,1,2,10,1,6,poor,20']);
  });

  const { design } = generateDesign(definition, { method: 'random', tasks: 8, blocks: 2, seed: 4 });

  it('round-trips a generated design through import', () => {
    const imported = importDesignCsv(definition, exportDesignCsv(definition, design));
    expect(imported).toEqual({ ok: true, design });
  });

  it('imports the same design saved by a spreadsheet as semicolon-separated "CSV UTF-8"', () => {
    // A comma-decimal locale's list separator, a byte-order mark and CRLF (server/lib/csv-dialect.ts).
    const csv = exportDesignCsv(definition, design);
    expect(csv).not.toContain('"');
    const saved = '\uFEFF' + csv.replaceAll(',', ';').replaceAll('\n', '\r\n');
    expect(importDesignCsv(definition, saved)).toEqual({ ok: true, design });
    // A numeric level written with a decimal comma there: the bill of 3 as "3,0".
    const first = saved.split('\r\n')[1].split(';');
    const bill = HEADER.split(',').indexOf('Monthly bill increase');
    const level = design.tasks[0].alternatives[0].levels.bill;
    first[bill] = `${definition.attributes[0].levels.find((l) => l.id === level)?.value},0`;
    const lines = saved.split('\r\n');
    lines[1] = first.join(';');
    expect(importDesignCsv(definition, lines.join('\r\n'))).toEqual({ ok: true, design });
  });
});

describe('importDesignCsv', () => {
  const rows = (...lines: string[]) => [HEADER, ...lines].join('\n');

  it('reports an unknown level with its row and column', () => {
    const result = importDesignCsv(
      definition,
      rows('1,1,1,3,2,0,fair,80', '1,1,2,7,1,6,splendid,20'),
    );
    expect(result).toEqual({
      ok: false,
      errors: [
        {
          row: 3,
          column: 'Monthly bill increase',
          message: '"7" is not a level of Monthly bill increase',
        },
        { row: 3, column: 'River health', message: '"splendid" is not a level of River health' },
      ],
    });
  });

  it('reports missing and unknown columns on the header row', () => {
    const result = importDesignCsv(definition, 'block,task,alternative,Colour\n1,1,1,red');
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.map((e) => [e.row, e.column])).toEqual([
      [1, 'Monthly bill increase'],
      [1, 'Supply interruptions per year'],
      [1, 'Taste/odour warning days'],
      [1, 'River health'],
      [1, 'Renewable pumping energy'],
      [1, 'Colour'],
    ]);
  });

  it('reports a task with the wrong number of alternatives', () => {
    const result = importDesignCsv(definition, rows('1,1,1,3,2,0,fair,80'));
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.errors[0]).toMatchObject({ row: 2, column: 'alternative' });
  });

  it('reports excluded combinations and duplicate alternatives', () => {
    const result = importDesignCsv(
      definition,
      rows(
        '1,1,1,0,2,0,good,80',
        '1,1,2,3,1,6,poor,20',
        '1,2,1,3,1,6,poor,20',
        '1,2,2,3,1,6,poor,20',
      ),
    );
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors).toEqual([
      {
        row: 2,
        column: null,
        message:
          'Task 1, alternative 1 breaks the excluded combination “Never Monthly bill increase “€0” together with River health “good””',
      },
      { row: 5, column: null, message: 'Task 2: alternative 2 repeats alternative 1' },
    ]);
  });

  it('reports bad numbers and a task split over blocks', () => {
    const result = importDesignCsv(
      definition,
      rows('x,1,1,3,2,0,fair,80', '1,2,1,3,2,0,fair,80', '3,2,2,10,1,6,poor,20'),
    );
    expect(result.ok).toBe(false);
    if (result.ok) return;
    const messages = result.errors.map((e) => `${e.row}:${e.column}:${e.message}`);
    expect(messages).toContain('2:block:"x" is not a whole number ≥ 1');
    expect(messages).toContain('4:block:Task 2 is already in block 1');
  });

  it('names the row a problem stands on, counting an empty line before it', () => {
    const result = importDesignCsv(definition, rows('', 'x,1,1,3,2,0,fair,80'));
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.errors.map((e) => `${e.row}:${e.column}`)).toContain('3:block');
  });

  it('reports a gap in the block numbers', () => {
    const result = importDesignCsv(
      definition,
      rows(
        '1,1,1,3,2,0,fair,80',
        '1,1,2,10,1,6,poor,20',
        '3,2,1,3,2,0,fair,80',
        '3,2,2,10,1,6,poor,20',
      ),
    );
    expect(result).toEqual({
      ok: false,
      errors: [{ row: 1, column: 'block', message: 'Block 2 has no tasks (blocks must run 1..3)' }],
    });
  });

  it('rejects an empty file', () => {
    expect(importDesignCsv(definition, HEADER)).toEqual({
      ok: false,
      errors: [{ row: 1, column: null, message: 'The file has no design rows' }],
    });
  });
});
