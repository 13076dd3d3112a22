/** The in-app help on the import files: their columns and the checks run before saving. */
export function ImportFormatHelp() {
  const code = (s: string) => <code className="font-mono text-xs">{s}</code>;
  return (
    <details className="rounded-md border border-line bg-canvas p-3 text-sm text-ink-soft">
      <summary className="cursor-pointer font-medium text-ink">What the files look like</summary>
      <div className="mt-2 space-y-2">
        <p>
          <strong>Choice file</strong>: the long format of the command-line estimator, one row per
          alternative shown, header on line 1: {code('respondent')}, {code('task')}, {code('alt')},{' '}
          {code('chosen')} (1 for the chosen alternative of a task, else 0), then one column per
          attribute with the level as the respondent saw it — a number for numeric attributes, a
          word for the others. For example:
        </p>
        <pre className="overflow-x-auto rounded bg-white p-2 font-mono text-xs">
          {`respondent,task,alt,chosen,bill,river\nH001,1,1,0,6,good\nH001,1,2,1,0,poor`}
        </pre>
        <p>
          <strong>Background answers</strong> (optional): a {code('respondent')} column with the
          same ids, then one column per question; numbers become number questions, anything else a
          single-choice question.
        </p>
        <p>
          Commas, semicolons or tabs may separate the columns, and the text may be UTF-8, UTF-16
          (&ldquo;Unicode text&rdquo;) or Windows-1252, as your spreadsheet saves them. Decimals are
          written with a point ({code('2.5')}), or with a comma ({code('2,5')}) in a file separated
          by semicolons.
        </p>
        <p>
          Before anything is saved the files are checked, and every problem is listed with its line
          and column: tasks with no or several chosen alternatives, tasks with another number of
          alternatives, duplicate rows, respondents whose attribute columns are filled on some rows
          and not others, values that are not numbers in a numeric attribute, values that are not a
          level, lines with the wrong number of fields. Files up to 256 MB.
        </p>
        <p>
          Imported data come from another survey: check that respondents gave informed consent for
          this analysis and that sharing the file follows your ethics approval and data-protection
          law.
        </p>
      </div>
    </details>
  );
}
