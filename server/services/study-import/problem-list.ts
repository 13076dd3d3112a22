/**
 * Collects an import's problems: every one is counted, the first ones (by file and line) are
 * kept for the preview and the error, so a file with a million bad lines costs no memory.
 */
import {
  IMPORT_MAX_PROBLEMS_LISTED,
  type ImportProblem,
} from '../../../shared/schemas/study-import';

export class ProblemList {
  count = 0;
  private kept: ImportProblem[] = [];

  add(problem: ImportProblem): void {
    this.count++;
    // Keep more than needed while reading, since checks that run after the file is read
    // report earlier lines; sorting then trims to the listed number.
    if (this.kept.length < IMPORT_MAX_PROBLEMS_LISTED * 5) this.kept.push(problem);
  }

  /** The first problems, choices file before background file, then by line. */
  listed(): ImportProblem[] {
    const rank = (p: ImportProblem) => (p.file === 'choices' ? 0 : 1);
    return [...this.kept]
      .sort((a, b) => rank(a) - rank(b) || (a.line ?? 0) - (b.line ?? 0))
      .slice(0, IMPORT_MAX_PROBLEMS_LISTED);
  }
}
