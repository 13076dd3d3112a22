/**
 * Pure helpers that build and change a study definition while it is edited. Ids are short
 * random strings (elementIdSchema) so renaming never breaks references.
 */
import { nanoid } from 'nanoid';
import type { Attribute, Level, StudyDefinition } from '@shared/schemas/study-definition';
import { formatNumericLevel } from '@/components/choice-task/format-level';

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
 * What is sent on save: empty labels of numeric levels become the formatted value, and
 * references to removed attributes or levels are dropped from the status quo, prohibitions
 * and labeled alternatives.
 */
export function normalizeDefinition(d: StudyDefinition): StudyDefinition {
  const attributes = d.attributes.map((a) => ({
    ...a,
    unit: a.kind === 'numeric' ? a.unit : undefined,
    referenceLevelId:
      a.coding === 'dummy' && a.levels.some((l) => l.id === a.referenceLevelId)
        ? a.referenceLevelId
        : undefined,
    levels: a.levels.map((l) =>
      a.kind === 'numeric'
        ? {
            ...l,
            label:
              l.label.trim() || (l.value !== undefined ? formatNumericLevel(l.value, a.unit) : ''),
          }
        : { id: l.id, label: l.label, ...(l.imageKey ? { imageKey: l.imageKey } : {}) },
    ),
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
    prohibitions: d.prohibitions.filter(
      (p) => levelExists(p.a.attributeId, p.a.levelId) && levelExists(p.b.attributeId, p.b.levelId),
    ),
  };
}

/** Keeps one labeled-alternative entry per designed alternative when the count changes. */
export function resizeLabels(d: StudyDefinition, count: number): StudyDefinition['alternatives'] {
  const labels = d.alternatives.labels.slice(0, count);
  while (labels.length < count)
    labels.push({ id: newId(), name: `Alternative ${labels.length + 1}`, omittedAttributeIds: [] });
  return { ...d.alternatives, count, labels };
}
