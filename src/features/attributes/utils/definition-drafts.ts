/**
 * Pure helpers that build and change a study definition while it is edited. Ids are short
 * random strings (elementIdSchema) so renaming never breaks references.
 */
import { nanoid } from 'nanoid';
import type {
  Attribute,
  ExcludedCombination,
  Level,
  StudyDefinition,
} from '@shared/schemas/study-definition';
import { checkLevelLabel, formatNumericLevel } from '@shared/study/level-labels';

export const newId = () => nanoid(10);

export function makeLevel(attribute: Pick<Attribute, 'kind' | 'unit'>, index: number): Level {
  return attribute.kind === 'numeric'
    ? { id: newId(), label: '', value: index }
    : { id: newId(), label: '' };
}

export function makeAttribute(kind: Attribute['kind'] = 'categorical'): Attribute {
  const base = { kind, unit: '' } as const;
  return {
    id: newId(),
    name: '',
    description: '',
    kind,
    unit: '',
    isCost: false,
    coding: kind === 'numeric' ? 'linear' : 'dummy',
    levels: [makeLevel(base, 0), makeLevel(base, 1)],
  };
}

export function moveItem<T>(items: T[], from: number, to: number): T[] {
  const next = items.slice();
  const [item] = next.splice(from, 1);
  next.splice(to, 0, item);
  return next;
}

/** Changing the kind keeps the levels and picks a coding that fits. */
export function changeKind(a: Attribute, kind: Attribute['kind']): Attribute {
  const levels = a.levels.map((l, i) =>
    kind === 'numeric' ? { ...l, value: l.value ?? (Number(l.label) || i) } : l,
  );
  return {
    ...a,
    kind,
    levels,
    isCost: kind === 'numeric' ? a.isCost : false,
    coding: kind === 'categorical' && a.coding === 'linear' ? 'dummy' : a.coding,
  };
}

/**
 * Numeric labels that merely repeat the value and unit become derived again (empty), so
 * they follow later changes of value or unit; a confirmation that no longer matches its
 * level's value and label is dropped. Used on load and on save.
 */
export function normalizeLevel(a: Pick<Attribute, 'kind' | 'unit'>, l: Level): Level {
  if (a.kind !== 'numeric')
    return { id: l.id, label: l.label, ...(l.imageKey ? { imageKey: l.imageKey } : {}) };
  const label = l.label.trim();
  const derived = l.value !== undefined ? formatNumericLevel(l.value, a.unit) : null;
  const next: Level = { ...l, label: label === derived ? '' : label };
  if (checkLevelLabel(a, next) !== 'confirmed') delete next.labelConfirmed;
  return next;
}

/** The saved definition as the editor starts from it (see normalizeLevel). */
export function toDraftDefinition(d: StudyDefinition): StudyDefinition {
  return {
    ...d,
    attributes: d.attributes.map((a) => ({
      ...a,
      levels: a.levels.map((l) => normalizeLevel(a, l)),
    })),
  };
}

/** Confirms (or withdraws) that a numeric level's own label is meant for its current value. */
export function confirmLevelLabel(l: Level, confirmed: boolean): Level {
  const next = { ...l };
  if (confirmed && l.value !== undefined)
    next.labelConfirmed = { value: l.value, label: l.label.trim() };
  else delete next.labelConfirmed;
  return next;
}

/**
 * What is sent on save: numeric labels as in normalizeLevel, and references to removed
 * attributes or levels dropped from the status quo, excluded combinations and labeled
 * alternatives.
 */
export function normalizeDefinition(d: StudyDefinition): StudyDefinition {
  const attributes = d.attributes.map((a) => ({
    ...a,
    unit: a.kind === 'numeric' ? a.unit : undefined,
    referenceLevelId:
      a.coding === 'dummy' && a.levels.some((l) => l.id === a.referenceLevelId)
        ? a.referenceLevelId
        : undefined,
    levels: a.levels.map((l) => normalizeLevel(a, l)),
  }));
  const levelExists = (attributeId: string, levelId: string) =>
    attributes.find((a) => a.id === attributeId)?.levels.some((l) => l.id === levelId) ?? false;
  const attributeIds = new Set(attributes.map((a) => a.id));
  const fixed = d.fixedAlternative;
  return {
    attributes,
    alternatives: {
      ...d.alternatives,
      labels: d.alternatives.labeled
        ? d.alternatives.labels.slice(0, d.alternatives.count).map((l) => ({
            ...l,
            omittedAttributeIds: l.omittedAttributeIds.filter((id) => attributeIds.has(id)),
          }))
        : [],
    },
    fixedAlternative: fixed
      ? {
          ...fixed,
          levels:
            fixed.kind === 'status_quo'
              ? Object.fromEntries(
                  Object.entries(fixed.levels).filter(([a, l]) => levelExists(a, l)),
                )
              : {},
        }
      : null,
    excludedCombinations: keepExcludedCombinations(d, attributes),
  };
}

/** Keeps one labeled-alternative entry per designed alternative when the count changes. */
export function resizeLabels(d: StudyDefinition, count: number): StudyDefinition['alternatives'] {
  const labels = d.alternatives.labels.slice(0, count);
  while (labels.length < count)
    labels.push({ id: newId(), name: `Alternative ${labels.length + 1}`, omittedAttributeIds: [] });
  return { ...d.alternatives, count, labels };
}

/** Excluded combinations that still refer to existing attributes, levels and alternatives. */
function keepExcludedCombinations(
  d: StudyDefinition,
  attributes: Attribute[],
): StudyDefinition['excludedCombinations'] {
  const levelIds = (attributeId: string) =>
    new Set(attributes.find((a) => a.id === attributeId)?.levels.map((l) => l.id) ?? []);
  const hasLevel = (attributeId: string, levelId: string) => levelIds(attributeId).has(levelId);
  const hasAttribute = (id: string) => attributes.some((a) => a.id === id);
  return d.excludedCombinations.flatMap((rule): ExcludedCombination[] => {
    switch (rule.kind) {
      case 'pair':
        return hasLevel(rule.a.attributeId, rule.a.levelId) &&
          hasLevel(rule.b.attributeId, rule.b.levelId)
          ? [rule]
          : [];
      case 'when_then': {
        const when = rule.when.levelIds.filter((l) => hasLevel(rule.when.attributeId, l));
        const then = rule.then.levelIds.filter((l) => hasLevel(rule.then.attributeId, l));
        return when.length > 0 && then.length > 0
          ? [
              {
                ...rule,
                when: { ...rule.when, levelIds: when },
                then: { ...rule.then, levelIds: then },
              },
            ]
          : [];
      }
      case 'versus_status_quo':
        return hasAttribute(rule.attributeId) && d.fixedAlternative?.kind === 'status_quo'
          ? [rule]
          : [];
      case 'between_alternatives':
        return hasAttribute(rule.attributeId) &&
          Math.max(rule.first, rule.second) < d.alternatives.count
          ? [rule]
          : [];
    }
  });
}
