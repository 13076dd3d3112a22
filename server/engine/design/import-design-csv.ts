/**
 * Reads a design CSV written by exportDesignCsv (or by hand in the same layout) and reports
 * every problem with its row number (1 = header), column and message instead of stopping at
 * the first: missing or unknown columns, bad numbers, unknown levels, tasks whose
 * alternative count differs from the study's, blocks not 1..B, excluded combinations and
 * duplicate alternatives. Level cells match the level label (trimmed, case-insensitive) or,
 * for numeric attributes, the numeric value (with a decimal comma in a semicolon-separated file,
 * server/lib/csv-dialect.ts).
 */
import {
  readCsvText,
  withDecimalPoint,
  type CsvDelimiter,
  type CsvRecord,
} from '../../lib/csv-dialect';
import { unescapeCsvText } from '../../lib/safe-csv';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { getLevelLabel } from '../../../shared/study/level-labels';
import { describeExcludedCombination } from '../../../shared/study/excluded-combinations';
import { listUnshownLevels } from './diagnostics/level-balance';
import { listRuleBreaches } from './rule-breaches';

export interface CsvRowError {
  row: number;
  column: string | null;
  message: string;
}

export type DesignCsvImport = { ok: true; design: Design } | { ok: false; errors: CsvRowError[] };

const MAX_ERRORS = 200;

function findLevelId(
  definition: StudyDefinition,
  attributeIndex: number,
  cell: string,
  delimiter: CsvDelimiter,
): string | undefined {
  const attribute = definition.attributes[attributeIndex];
  const text = unescapeCsvText(cell.trim());
  const byLabel = attribute.levels.find(
    (l) => getLevelLabel(attribute, l).toLowerCase() === text.toLowerCase(),
  );
  if (byLabel) return byLabel.id;
  const value = Number(withDecimalPoint(text, delimiter));
  if (attribute.kind === 'numeric' && text !== '' && Number.isFinite(value))
    return attribute.levels.find((l) => l.value === value)?.id;
  return undefined;
}

function readTasks(
  definition: StudyDefinition,
  records: CsvRecord[],
  delimiter: CsvDelimiter,
  errors: CsvRowError[],
) {
  const header = records[0].record.map((h) => unescapeCsvText(h.trim()));
  const column = (name: string) => header.findIndex((h) => h.toLowerCase() === name.toLowerCase());
  const fixed = ['block', 'task', 'alternative'].map(column);
  const attributeColumns = definition.attributes.map((a) => column(a.name));
  ['block', 'task', 'alternative'].forEach((name, i) => {
    if (fixed[i] < 0) errors.push({ row: 1, column: name, message: `Missing column "${name}"` });
  });
  definition.attributes.forEach((a, i) => {
    if (attributeColumns[i] < 0)
      errors.push({ row: 1, column: a.name, message: `Missing column "${a.name}"` });
  });
  const known = new Set([
    'block',
    'task',
    'alternative',
    ...definition.attributes.map((a) => a.name.toLowerCase()),
  ]);
  header.forEach((h) => {
    if (!known.has(h.toLowerCase()))
      errors.push({ row: 1, column: h, message: `Unknown column "${h}"` });
  });
  if (errors.length > 0) return null;
  const tasks = new Map<
    number,
    {
      block: number;
      row: number;
      alternatives: Map<number, { row: number; levels: Record<string, string> }>;
    }
  >();
  records.slice(1).forEach(({ record, line: row }) => {
    const int = (name: string, index: number) => {
      const value = Number((record[index] ?? '').trim());
      if (!Number.isInteger(value) || value < 1) {
        errors.push({
          row,
          column: name,
          message: `"${record[index] ?? ''}" is not a whole number ≥ 1`,
        });
        return null;
      }
      return value;
    };
    const [block, taskNo, alt] = [
      int('block', fixed[0]),
      int('task', fixed[1]),
      int('alternative', fixed[2]),
    ];
    const levels: Record<string, string> = {};
    definition.attributes.forEach((attribute, a) => {
      const cell = record[attributeColumns[a]] ?? '';
      const omitted =
        definition.alternatives.labeled &&
        alt !== null &&
        definition.alternatives.labels[alt - 1]?.omittedAttributeIds.includes(attribute.id);
      if (omitted) return;
      const levelId = findLevelId(definition, a, cell, delimiter);
      if (levelId === undefined)
        errors.push({
          row,
          column: attribute.name,
          message: `"${cell}" is not a level of ${attribute.name}`,
        });
      else levels[attribute.id] = levelId;
    });
    if (block === null || taskNo === null || alt === null) return;
    const task = tasks.get(taskNo) ?? { block, row, alternatives: new Map() };
    if (task.block !== block)
      errors.push({
        row,
        column: 'block',
        message: `Task ${taskNo} is already in block ${task.block}`,
      });
    if (task.alternatives.has(alt))
      errors.push({
        row,
        column: 'alternative',
        message: `Task ${taskNo} has alternative ${alt} twice`,
      });
    task.alternatives.set(alt, { row, levels });
    tasks.set(taskNo, task);
  });
  return tasks;
}

function checkTask(
  definition: StudyDefinition,
  taskNo: number,
  task: { row: number; alternatives: Map<number, { row: number; levels: Record<string, string> }> },
  errors: CsvRowError[],
): void {
  const J = definition.alternatives.count;
  const numbers = [...task.alternatives.keys()].sort((p, q) => p - q);
  if (numbers.length !== J || numbers.some((n, i) => n !== i + 1)) {
    errors.push({
      row: task.row,
      column: 'alternative',
      message: `Task ${taskNo} needs alternatives 1..${J}, found ${numbers.join(', ')}`,
    });
    return;
  }
  const seen = new Map<string, number>();
  for (const n of numbers) {
    const { row, levels } = task.alternatives.get(n)!;
    const key = JSON.stringify(definition.attributes.map((a) => levels[a.id] ?? null));
    if (seen.has(key))
      errors.push({
        row,
        column: null,
        message: `Task ${taskNo}: alternative ${n} repeats alternative ${seen.get(key)}`,
      });
    else seen.set(key, n);
  }
}

/** Parses a design CSV against a study definition; see the file comment. */
export function importDesignCsv(definition: StudyDefinition, text: string): DesignCsvImport {
  let delimiter: CsvDelimiter;
  let records: CsvRecord[];
  try {
    ({ delimiter, records } = readCsvText(text, { trim: false, sameFieldCount: false }));
  } catch (error) {
    const line = (error as { lines?: number }).lines ?? 1;
    return { ok: false, errors: [{ row: line, column: null, message: (error as Error).message }] };
  }
  if (records.length < 2)
    return {
      ok: false,
      errors: [{ row: 1, column: null, message: 'The file has no design rows' }],
    };
  const errors: CsvRowError[] = [];
  const tasks = readTasks(definition, records, delimiter, errors);
  if (tasks) for (const [taskNo, task] of tasks) checkTask(definition, taskNo, task, errors);
  const blocks = tasks ? Math.max(...[...tasks.values()].map((t) => t.block)) : 0;
  if (tasks && blocks > 50) errors.push({ row: 1, column: 'block', message: 'At most 50 blocks' });
  if (tasks)
    for (let b = 1; b <= blocks; b++)
      if (![...tasks.values()].some((t) => t.block === b))
        errors.push({
          row: 1,
          column: 'block',
          message: `Block ${b} has no tasks (blocks must run 1..${blocks})`,
        });
  if (!tasks) return { ok: false, errors: errors.slice(0, MAX_ERRORS) };
  const design: Design = {
    blocks,
    tasks: [...tasks.entries()]
      .sort((p, q) => p[0] - q[0])
      .map(([taskNo, task]) => ({
        block: task.block,
        task: taskNo,
        alternatives: [...task.alternatives.entries()]
          .sort((p, q) => p[0] - q[0])
          .map(([, a]) => ({ levels: a.levels })),
      })),
  };
  errors.push(...checkRules(definition, design, tasks));
  // A level never shown is a fault of the whole design: named once the rows are right.
  if (errors.length === 0)
    for (const missing of listUnshownLevels(definition, design))
      errors.push({
        row: 1,
        column: missing.attribute.name,
        message: `The level “${getLevelLabel(missing.attribute, missing.level)}” of ${missing.attribute.name} never appears`,
      });
  if (errors.length > 0)
    return { ok: false, errors: errors.sort((p, q) => p.row - q.row).slice(0, MAX_ERRORS) };
  return { ok: true, design };
}

/** Excluded combinations the design breaks, at their rows (none when tasks are malformed). */
function checkRules(
  definition: StudyDefinition,
  design: Design,
  tasks: NonNullable<ReturnType<typeof readTasks>>,
): CsvRowError[] {
  let breaches;
  try {
    breaches = listRuleBreaches(definition, design);
  } catch {
    return []; // tasks of the wrong shape are reported already
  }
  return breaches.map((breach) => {
    const taskNo = design.tasks[breach.taskIndex].task;
    const task = tasks.get(taskNo)!;
    const rule = describeExcludedCombination(
      definition,
      definition.excludedCombinations[breach.rule],
    );
    return {
      row: breach.alternative < 0 ? task.row : task.alternatives.get(breach.alternative + 1)!.row,
      column: null,
      message: `Task ${taskNo}${breach.alternative >= 0 ? `, alternative ${breach.alternative + 1}` : ''} breaks the excluded combination “${rule}”`,
    };
  });
}
