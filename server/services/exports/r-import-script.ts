/**
 * An R script (base R only, our own template) that reads the wide respondent file with the
 * right types: column classes from the codebook formats, factors with their levels in the
 * order offered, date-times as POSIXct in UTC, and the spreadsheet formula guard (a leading
 * ' before =, +, −, @, tab or carriage return; server/lib/safe-csv.ts) taken off text cells.
 */
import type { ColumnFormat, DocumentedTable } from './documented-table';

export type RClass = 'character' | 'integer' | 'numeric' | 'logical';

export function rClassOf(format: ColumnFormat): RClass {
  if (format === 'text') return 'character';
  if (format === 'integer') return 'integer';
  if (format === 'logical') return 'logical';
  return 'numeric';
}

/** An R string literal; JSON's escapes (\", \\, \n, \uXXXX) are valid in R strings. */
const rString = (s: string) => JSON.stringify(s);

export function renderRImportScript(
  table: DocumentedTable,
  csvName: string,
  about: { study: string; exportedAt: Date },
): string {
  const classes = table.columns
    .map((c) => `  ${rString(c.key)} = ${rString(rClassOf(c.format))}`)
    .join(',\n');
  const factors = table.columns
    .filter((c) => c.levels)
    .map(
      (c) =>
        `d[[${rString(c.key)}]] <- factor(d[[${rString(c.key)}]], levels = c(${c.levels!.map(rString).join(', ')}))`,
    );
  const times = table.columns
    .filter((c) => c.unit === 'date-time, UTC')
    .map(
      (c) =>
        `d[[${rString(c.key)}]] <- as.POSIXct(d[[${rString(c.key)}]], format = "%Y-%m-%dT%H:%M:%OSZ", tz = "UTC")`,
    );
  return [
    `# Reads the wide respondent file of the study ${rString(about.study)}`,
    `# (exported ${about.exportedAt.toISOString()}) with the right column types and factor levels.`,
    '# Base R only. Put the CSV beside this script, or change `path` below.',
    '# Every column is explained in the codebook download of the Exports section.',
    '',
    `path <- ${rString(csvName)}`,
    '',
    'col_types <- c(',
    classes,
    ')',
    '',
    'd <- read.csv(path, colClasses = col_types, na.strings = "", check.names = FALSE,',
    '              fileEncoding = "UTF-8", stringsAsFactors = FALSE)',
    'stopifnot(identical(names(d), names(col_types)))',
    '',
    "# Text cells that began with =, +, -, @, tab or return were written with a leading ' so",
    '# that spreadsheet programs do not run them as formulas; take it off again.',
    'unguard <- function(x) sub("^\'(?=[=+@\\t\\r-])", "", x, perl = TRUE)',
    'for (v in names(col_types)[col_types == "character"]) d[[v]] <- unguard(d[[v]])',
    '',
    ...(factors.length > 0
      ? ['# Answers with a fixed set of values, levels in the order offered.', ...factors, '']
      : []),
    ...times,
    '',
    '# Respondents who count in the analysis:',
    'analysed <- d[d$included, ]',
    '',
  ].join('\n');
}
