/**
 * When no design keeps every rule, say which rule binds, in the researcher's words:
 * 1. level counts: an attribute with no level left for designed alternatives, or more
 *    required appearances than the design has places;
 * 2. single alternatives: how many level combinations keep every excluded combination (all of
 *    them when there are at most 200 000, else a seeded sample), and which rule, dropped alone,
 *    would leave enough — also per level that no alternative can show;
 * 3. whole tasks: whether random tasks of allowed alternatives can keep the rules between
 *    alternatives (identical, dominance, rules between alternatives, overlap), and which
 *    switch, turned off alone, would allow them.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { DesignSpec } from '../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { describeExcludedCombination } from '../../../shared/study/excluded-combinations';
import { getLevelLabel } from '../../../shared/study/level-labels';
import { buildDesignConstraints } from './compile-design-rules';
import {
  checkAlternativeLevels,
  isTaskValid,
  Violation,
  type DesignConstraints,
} from './design-constraints';
import type { LevelGrid } from './design-grid';
import type { LevelBounds } from './level-bounds';
import { DESIGN_STREAM } from './design-random';
import { createPrng } from '../draws/prng';
import { randomIndex } from '../draws/random-index';

const ENUMERATION_LIMIT = 200_000;
const SAMPLE = 20_000;
const TASK_TRIES = 4_000;

type Input = {
  plan: CodingPlan;
  definition: StudyDefinition;
  spec: DesignSpec;
  priorMeans: Float64Array;
  priorSds: Float64Array;
  constraints: DesignConstraints;
  bounds: LevelBounds;
};

const quote = (text: string) => `“${text}”`;

function levelName(definition: StudyDefinition, a: number, l: number): string {
  const attribute = definition.attributes[a];
  return `${attribute.name} ${quote(getLevelLabel(attribute, attribute.levels[l]))}`;
}

/** Level combinations of one alternative that keep the excluded combinations (per level too). */
function countProfiles(plan: CodingPlan, c: DesignConstraints) {
  const A = plan.attributes.length;
  const total = plan.attributes.reduce((n, a) => n * a.levelIds.length, 1);
  const enumerate = total <= ENUMERATION_LIMIT;
  const tries = enumerate ? total : SAMPLE;
  const random = createPrng(7, DESIGN_STREAM);
  const probe: LevelGrid = { S: 1, J: 1, A, levels: new Int32Array(A) };
  const one = { ...c, J: 1 };
  let ok = 0;
  const perLevel = new Float64Array(c.levelTotal);
  const rows: Int32Array[] = [];
  for (let i = 0; i < tries; i++) {
    let rest = i;
    for (let a = A - 1; a >= 0; a--) {
      const L = plan.attributes[a].levelIds.length;
      probe.levels[a] = enumerate ? rest % L : randomIndex(random, L);
      rest = Math.floor(rest / L);
    }
    if (checkAlternativeLevels(one, probe, 0, 0) !== Violation.none) continue;
    ok++;
    for (let a = 0; a < A; a++) perLevel[c.levelBase[a] + probe.levels[a]]++;
    if (rows.length < 5_000) rows.push(probe.levels.slice());
  }
  const scale = enumerate ? 1 : total / tries;
  return { count: Math.round(ok * scale), exact: enumerate, perLevel, rows };
}

/** Can random tasks built from allowed alternatives keep every task rule? */
function someTaskIsValid(plan: CodingPlan, c: DesignConstraints, rows: Int32Array[]): boolean {
  const J = plan.designedCount;
  const A = plan.attributes.length;
  if (rows.length === 0) return false;
  const grid: LevelGrid = { S: 1, J, A, levels: new Int32Array(J * A) };
  const random = createPrng(11, DESIGN_STREAM);
  for (let i = 0; i < TASK_TRIES; i++) {
    for (let j = 0; j < J; j++) {
      const row = rows[randomIndex(random, rows.length)];
      for (let a = 0; a < A; a++)
        grid.levels[j * A + a] = plan.omitted[j * A + a] === 1 ? -1 : row[a];
    }
    if (isTaskValid(c, grid, 0)) return true;
  }
  return false;
}

/** The message; see the file comment. */
export function explainInfeasibleDesign(input: Input): string {
  const { plan, definition, spec, constraints: c, bounds } = input;
  const rules = definition.excludedCombinations;
  const ruleText = (r: number) => quote(describeExcludedCombination(definition, rules[r]));
  // 1. Level counts.
  for (let a = 0; a < plan.attributes.length; a++) {
    const L = plan.attributes[a].levelIds.length;
    const allowed = Array.from({ length: L }, (_, l) => l).filter(
      (l) => c.levelRule[c.levelBase[a] + l] < 0,
    );
    const name = definition.attributes[a].name;
    if (allowed.length === 0)
      return `No level of ${name} can appear in a designed alternative. The rule that binds: ${ruleText(c.levelRule[c.levelBase[a]])}.`;
    let needed = 0;
    for (const l of allowed) needed += bounds.min[c.levelBase[a] + l];
    if (needed > bounds.cells[a])
      return `${name} has ${bounds.cells[a]} places in the designed alternatives of ${input.spec.tasks} tasks, but its ${allowed.length} levels need ${needed} appearances. The rule that binds: ${spec.balance.levelBalance ? 'level balance' : `at least ${spec.balance.minAppearances} appearances of every level`}; add tasks or lower it.`;
  }
  // 2. Single alternatives.
  const withAll = countProfiles(plan, c);
  const needed = plan.designedCount + (c.statusQuo ? 1 : 0);
  /** The constraints with excluded combination r dropped. */
  const constraintsWithout = (r: number) =>
    buildDesignConstraints(
      plan,
      { ...definition, excludedCombinations: rules.filter((_, i) => i !== r) },
      input.priorMeans,
      input.priorSds,
      spec,
    );
  const without = (r: number) => countProfiles(plan, constraintsWithout(r));
  if (withAll.count < needed) {
    const freeing = rules
      .map((_, r) => ({ r, count: without(r).count }))
      .filter((x) => x.count >= needed)
      .map((x) => `${ruleText(x.r)} (without it, ${x.count} alternatives qualify)`);
    const head = `Only ${withAll.count} level combination${withAll.count === 1 ? '' : 's'} of one alternative keep${withAll.count === 1 ? 's' : ''} every excluded combination; a task needs ${needed} different ones.`;
    return freeing.length > 0
      ? `${head} The rule that binds: ${freeing.join('; or ')}.`
      : `${head} These excluded combinations bind together: ${rules.map((_, r) => ruleText(r)).join('; ')}. Remove some of them, or add levels.`;
  }
  for (let f = 0; f < c.levelTotal; f++) {
    if (bounds.min[f] === 0 || withAll.perLevel[f] > 0) continue;
    let a = 0;
    while (c.levelBase[a + 1] <= f) a++;
    const l = f - c.levelBase[a];
    const freeing = rules
      .map((_, r) => r)
      .filter((r) => without(r).perLevel[f] > 0)
      .map(ruleText);
    return `${levelName(definition, a, l)} cannot appear in any designed alternative, yet every level must appear at least ${bounds.min[f]} time${bounds.min[f] === 1 ? '' : 's'}. ${freeing.length > 0 ? `The rule that binds: ${freeing.join('; or ')}.` : `These excluded combinations bind together: ${rules.map((_, r) => ruleText(r)).join('; ')}.`}`;
  }
  // 3. Whole tasks.
  if (!someTaskIsValid(plan, c, withAll.rows)) {
    const fixedName = quote(definition.fixedAlternative?.label ?? 'the opt-out');
    const switches: { label: string; relaxed: DesignConstraints }[] = [
      {
        label: 'no designed alternative may dominate another',
        relaxed: { ...c, checks: { ...c.checks, betweenDesigned: false } },
      },
      {
        label: `no designed alternative may dominate ${fixedName}`,
        relaxed: { ...c, checks: { ...c.checks, overFixed: false } },
      },
      {
        label: `${fixedName} may not dominate a designed alternative`,
        relaxed: { ...c, checks: { ...c.checks, byFixed: false } },
      },
      {
        label: `at most ${c.maxOverlap} attributes the same in every alternative of a task`,
        relaxed: { ...c, maxOverlap: -1 },
      },
      ...c.between.map((rule, i) => ({
        label: describeExcludedCombination(definition, rules[rule.rule]),
        relaxed: { ...c, between: c.between.filter((_, k) => k !== i) },
      })),
    ];
    const active = switches.filter(
      (_, i) =>
        (i === 0 && c.checks.betweenDesigned) ||
        (i === 1 && c.checks.overFixed) ||
        (i === 2 && c.checks.byFixed) ||
        (i === 3 && c.maxOverlap >= 0) ||
        i > 3,
    );
    const tests = [
      ...active.map((s) => ({
        label: s.label,
        frees: () => someTaskIsValid(plan, s.relaxed, withAll.rows),
      })),
      // Rules on single alternatives narrow the alternatives tasks are built from.
      ...rules
        .map((rule, r) => ({ rule, r }))
        .filter(({ rule }) => rule.kind !== 'between_alternatives')
        .map(({ rule, r }) => ({
          label: describeExcludedCombination(definition, rule),
          frees: () => {
            const relaxed = constraintsWithout(r);
            return someTaskIsValid(plan, relaxed, countProfiles(plan, relaxed).rows);
          },
        })),
    ];
    const freeing = tests.filter((t) => t.frees());
    const head = `No choice task of ${plan.designedCount} alternatives keeps every rule at once.`;
    if (freeing.length > 0)
      return `${head} The rule that binds: ${freeing.map((t) => quote(t.label)).join('; or ')}.`;
    return `${head} These rules bind together: ${tests.map((t) => quote(t.label)).join('; ')}. Switch some off, or add levels.`;
  }
  return `Could not place every level often enough in ${spec.tasks} tasks under these rules (at least ${spec.balance.minAppearances} appearance${spec.balance.minAppearances === 1 ? '' : 's'} each${spec.balance.levelBalance ? ', level balance' : ''}). Add tasks, or relax the excluded combinations or the balance rules.`;
}
