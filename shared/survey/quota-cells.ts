/**
 * Segment quotas on a screening question. The cells must partition the answers the question
 * accepts: every accepted option (single choice) or every accepted whole number (number
 * question) in exactly one cell, so each qualified respondent counts towards one target.
 * A definition with a gap or an overlap is refused with the gap or overlap named, since a
 * respondent in a gap would pass unlimited and one in an overlap would be counted twice.
 * Pure: the questionnaire schema runs the checks, the server classifies answers with it.
 */
import type { QuotaCell, ScreeningPage } from '../schemas/questionnaire';
import type { AnswerValue } from '../schemas/respondent';

export type QuotaProblem = { path: (string | number)[]; message: string };

/** The accepted whole numbers of a number question: [lo, hi], both inclusive. */
export function acceptedRange(page: ScreeningPage): { lo: number; hi: number } | null {
  const q = page.question;
  if (q.type !== 'number') return null;
  const lo = Math.ceil(Math.max(q.min, page.acceptMin ?? -Infinity));
  const hi = Math.floor(Math.min(q.max, page.acceptMax ?? Infinity));
  return { lo, hi };
}

const fall = (a: number, b: number) =>
  a === b ? `Answer ${a} falls` : `Answers ${a} to ${b} fall`;

function choiceProblems(page: ScreeningPage): QuotaProblem[] {
  const q = page.question;
  if (q.type !== 'single') return [];
  const problems: QuotaProblem[] = [];
  const known = new Set(q.options.map((o) => o.id));
  page.quotaCells.forEach((cell, c) => {
    if (cell.optionIds.length === 0)
      problems.push({
        path: [c, 'optionIds'],
        message: `Give "${cell.label}" at least one answer`,
      });
    for (const id of cell.optionIds) {
      if (!known.has(id))
        problems.push({
          path: [c, 'optionIds'],
          message: `"${cell.label}" names an unknown answer`,
        });
      else if (page.screenOutOptionIds.includes(id))
        problems.push({
          path: [c, 'optionIds'],
          message: `"${cell.label}" takes an answer that screens respondents out`,
        });
    }
  });
  for (const option of q.options) {
    if (page.screenOutOptionIds.includes(option.id)) continue;
    const cells = page.quotaCells.filter((cell) => cell.optionIds.includes(option.id));
    if (cells.length === 0)
      problems.push({ path: [], message: `The answer "${option.label}" is in no quota cell` });
    else if (cells.length > 1)
      problems.push({
        path: [],
        message: `The answer "${option.label}" is in more than one quota cell (${cells.map((c) => c.label).join(', ')})`,
      });
  }
  return problems;
}

function numberProblems(page: ScreeningPage): QuotaProblem[] {
  const q = page.question;
  if (q.type !== 'number') return [];
  if (!q.integer) return [{ path: [], message: 'Quotas on a number question need whole numbers' }];
  const { lo, hi } = acceptedRange(page)!;
  const problems: QuotaProblem[] = [];
  page.quotaCells.forEach((cell, c) => {
    if (cell.from === null || cell.to === null)
      problems.push({ path: [c, 'from'], message: `Give "${cell.label}" a range` });
    else if (cell.from > cell.to)
      problems.push({ path: [c, 'to'], message: `"${cell.label}" ends before it starts` });
    else if (cell.from < lo || cell.to > hi)
      problems.push({
        path: [c, 'from'],
        message: `"${cell.label}" reaches outside the accepted answers (${lo} to ${hi})`,
      });
  });
  if (problems.length > 0) return problems;
  const cells = [...page.quotaCells].sort((a, b) => a.from! - b.from!);
  let next = lo; // the lowest accepted answer not yet in a cell
  let previous: QuotaCell | null = null;
  for (const cell of cells) {
    if (cell.from! > next)
      problems.push({ path: [], message: `${fall(next, cell.from! - 1)} in no quota cell` });
    else if (previous && cell.from! < next)
      problems.push({
        path: [],
        message: `${fall(cell.from!, Math.min(next - 1, cell.to!))} in two quota cells (${previous.label}, ${cell.label})`,
      });
    if (cell.to! + 1 > next) {
      next = cell.to! + 1;
      previous = cell;
    }
  }
  if (next <= hi) problems.push({ path: [], message: `${fall(next, hi)} in no quota cell` });
  return problems;
}

/** Why the page's quota cells cannot be used as they are; empty when they can (or there are none). */
export function quotaProblems(page: ScreeningPage): QuotaProblem[] {
  if (page.quotaCells.length === 0) return [];
  const q = page.question;
  if (q.type !== 'single' && q.type !== 'number')
    return [{ path: [], message: 'Quotas need a single-choice or number screening question' }];
  const problems: QuotaProblem[] = [];
  if (page.showIf)
    problems.push({
      path: [],
      message: 'A screening question with quotas must be asked of everyone',
    });
  if (!q.required)
    problems.push({ path: [], message: 'A screening question with quotas must be required' });
  const ids = page.quotaCells.map((c) => c.id);
  if (new Set(ids).size !== ids.length)
    problems.push({ path: [], message: 'Quota cell ids must be unique' });
  return [...problems, ...(q.type === 'single' ? choiceProblems(page) : numberProblems(page))];
}

/** The cell an answer counts towards, or null (screened out, or the page has no quotas). */
export function quotaCellOf(page: ScreeningPage, value: AnswerValue): QuotaCell | null {
  if (value.kind === 'single' && value.optionId !== null) {
    const id = value.optionId;
    return page.quotaCells.find((c) => c.optionIds.includes(id)) ?? null;
  }
  if (value.kind === 'number' && value.number !== null) {
    const n = value.number;
    return (
      page.quotaCells.find((c) => c.from !== null && c.to !== null && c.from <= n && n <= c.to) ??
      null
    );
  }
  return null;
}
