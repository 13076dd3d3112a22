/**
 * Excluded combinations in words, for the editor, the design diagnostics and error messages
 * (one wording everywhere), and their checks on one alternative or one task by level ids.
 */
import type {
  Attribute,
  ExcludedCombination,
  Relation,
  StudyDefinition,
} from '../schemas/study-definition';
import { getLevelLabel } from './level-labels';

export const relationWords: Record<Relation, string> = {
  greater: 'above',
  at_least: 'at or above',
  less: 'below',
  at_most: 'at or below',
  different: 'different from',
  same: 'the same as',
};

/** Relations that compare values, so they need a numeric attribute. */
export const orderingRelations: ReadonlySet<Relation> = new Set([
  'greater',
  'at_least',
  'less',
  'at_most',
]);

/** True when `x relation y` holds (values for ordering relations, level ids otherwise). */
export function holdsRelation(relation: Relation, x: number, y: number): boolean {
  switch (relation) {
    case 'greater':
      return x > y;
    case 'at_least':
      return x >= y;
    case 'less':
      return x < y;
    case 'at_most':
      return x <= y;
    case 'different':
      return x !== y;
    case 'same':
      return x === y;
  }
}

function attributeOf(d: StudyDefinition, id: string): Attribute | undefined {
  return d.attributes.find((a) => a.id === id);
}

function levelText(a: Attribute | undefined, levelId: string): string {
  const level = a?.levels.find((l) => l.id === levelId);
  return level && a ? getLevelLabel(a, level) || levelId : levelId;
}

function levelList(a: Attribute | undefined, ids: string[]): string {
  const names = ids.map((id) => `“${levelText(a, id)}”`);
  return names.length <= 1
    ? (names[0] ?? '')
    : `${names.slice(0, -1).join(', ')} or ${names.at(-1)}`;
}

/** Name of designed alternative j: its label when alternatives are labeled, else a letter. */
export function designedAlternativeName(d: StudyDefinition, j: number): string {
  return d.alternatives.labeled
    ? (d.alternatives.labels[j]?.name ?? `Alternative ${j + 1}`)
    : `Option ${String.fromCharCode(65 + j)}`;
}

/** The rule in one plain sentence. */
export function describeExcludedCombination(d: StudyDefinition, rule: ExcludedCombination): string {
  switch (rule.kind) {
    case 'pair': {
      const a = attributeOf(d, rule.a.attributeId);
      const b = attributeOf(d, rule.b.attributeId);
      return `Never ${a?.name ?? '?'} “${levelText(a, rule.a.levelId)}” together with ${b?.name ?? '?'} “${levelText(b, rule.b.levelId)}”`;
    }
    case 'when_then': {
      const a = attributeOf(d, rule.when.attributeId);
      const b = attributeOf(d, rule.then.attributeId);
      return `When ${a?.name ?? '?'} is ${levelList(a, rule.when.levelIds)}, ${b?.name ?? '?'} is ${levelList(b, rule.then.levelIds)}`;
    }
    case 'versus_status_quo': {
      const a = attributeOf(d, rule.attributeId);
      return `${a?.name ?? '?'} of every designed alternative is ${relationWords[rule.relation]} the status quo’s`;
    }
    case 'between_alternatives': {
      const a = attributeOf(d, rule.attributeId);
      return `${a?.name ?? '?'} of ${designedAlternativeName(d, rule.first)} is ${relationWords[rule.relation]} that of ${designedAlternativeName(d, rule.second)}`;
    }
  }
}
