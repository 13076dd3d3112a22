/**
 * One pass over the uploaded files and every check, shared by the preview and the save: read
 * the choice file as a stream, check tasks, take the set-up sent (or infer one from the
 * columns), match values to levels, check respondents' columns, group the choice sets, then
 * read the background file. Nothing here touches the database.
 */
import type { Readable } from 'node:stream';
import type {
  ImportAttribute,
  ImportPreview,
  ImportSetup,
} from '../../../shared/schemas/study-import';
import { checkRespondentColumns, checkTasks } from './choice-file-checks';
import { groupChoiceSets, type GroupedChoiceSets } from './group-choice-sets';
import { inferAttributes } from './infer-attributes';
import { matchLevels, type MatchedAttribute } from './match-levels';
import { readBackgroundFile, type BackgroundScan } from './read-background-file';
import { readChoiceFile, type ChoiceFileScan } from './read-choice-file';

export interface ImportFiles {
  choices: Readable;
  background: Readable | null;
}

export interface ImportAnalysis {
  scan: ChoiceFileScan;
  alternativesPerTask: number;
  attributes: ImportAttribute[];
  matched: MatchedAttribute[];
  grouped: GroupedChoiceSets;
  background: BackgroundScan | null;
}

export async function analyseImport(
  files: ImportFiles,
  setup: Pick<ImportSetup, 'attributes'> | null,
): Promise<ImportAnalysis> {
  const scan = await readChoiceFile(files.choices);
  const empty: GroupedChoiceSets = {
    sets: [],
    taskSet: new Int32Array(0),
    taskChosen: new Int32Array(0),
  };
  if (!scan.readable) {
    files.background?.destroy();
    return {
      scan,
      alternativesPerTask: 0,
      attributes: setup?.attributes ?? [],
      matched: [],
      grouped: empty,
      background: null,
    };
  }
  const alternativesPerTask = checkTasks(scan);
  const attributes = setup?.attributes ?? inferAttributes(scan.columns);
  const columnsUsed = new Set<string>();
  for (const a of attributes) {
    if (columnsUsed.has(a.column))
      scan.problems.add({
        file: 'choices',
        line: 1,
        column: a.column,
        code: 'missing_column',
        message: `Two attributes read the column “${a.column}”; give each attribute its own column.`,
      });
    columnsUsed.add(a.column);
  }
  const matched = matchLevels(scan, attributes);
  checkRespondentColumns(
    scan,
    matched.map((m) => m.columnIndex),
  );
  const grouped = groupChoiceSets(scan, matched);
  const background = files.background
    ? await readBackgroundFile(
        files.background,
        new Map(scan.respondents.map((id, r) => [id, r])),
        scan.problems,
      )
    : null;
  return { scan, alternativesPerTask, attributes, matched, grouped, background };
}

export function toImportPreview(analysis: ImportAnalysis): ImportPreview {
  const { scan, background } = analysis;
  return {
    rows: scan.rows,
    respondents: scan.respondents.length,
    tasks: scan.taskId.length,
    alternativesPerTask: analysis.alternativesPerTask,
    choiceSets: analysis.grouped.sets.length,
    columns: scan.header,
    attributes: analysis.attributes,
    background: background
      ? {
          columns: background.columns.map(({ column, key, text, type }) => ({
            column,
            key,
            text,
            type,
          })),
          respondents: background.answers.size,
        }
      : null,
    problemCount: scan.problems.count,
    problems: scan.problems.listed(),
  };
}
