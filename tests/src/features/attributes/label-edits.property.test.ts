/**
 * Property test over edit sequences of a numeric attribute (values, unit, own labels,
 * confirmations, saves), through the editor's own draft functions, the shared schema and the
 * go-live check: whatever the researcher does, a label respondents see either writes its
 * coded value, or the researcher confirmed it for that value, or go-live refuses that level —
 * and the editor flags exactly the levels go-live refuses. Labels left empty follow later
 * changes of value and unit instead of being frozen at save.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { studyDefinitionSchema, type StudyDefinition } from '@shared/schemas/study-definition';
import {
  makeStudyDefinition,
  numericLevels,
} from '../../../../scripts/lib/study-factory/definition';
import {
  checkLevelLabel,
  formatNumericLevel,
  getLevelLabel,
  labelShowsValue,
} from '@shared/study/level-labels';
import {
  confirmLevelLabel,
  normalizeDefinition,
  toDraftDefinition,
} from '@/features/attributes/utils/definition-drafts';
import { checkReadiness } from '@server/services/readiness';

const start: StudyDefinition = makeStudyDefinition({
  only: ['bill'],
  attributes: { bill: { levels: numericLevels('b', [0, 3, 6], () => '') } },
  fixedAlternative: null,
});

type Edit =
  | { kind: 'value'; level: number; value: number }
  | { kind: 'unit'; unit: string }
  | { kind: 'label'; level: number; text: 'empty' | 'derived' | 'stale' | 'words' | 'writes' }
  | { kind: 'confirm'; level: number; on: boolean }
  | { kind: 'save' };

const editArbitrary: fc.Arbitrary<Edit> = fc.oneof(
  fc.record({
    kind: fc.constant('value' as const),
    level: fc.integer({ min: 0, max: 2 }),
    value: fc.constantFrom(0, 2.5, 3, 6, 8, 10, 1000),
  }),
  fc.record({ kind: fc.constant('unit' as const), unit: fc.constantFrom('', '€', '%', 'days') }),
  fc.record({
    kind: fc.constant('label' as const),
    level: fc.integer({ min: 0, max: 2 }),
    text: fc.constantFrom('empty', 'derived', 'stale', 'words', 'writes'),
  }),
  fc.record({
    kind: fc.constant('confirm' as const),
    level: fc.integer({ min: 0, max: 2 }),
    on: fc.boolean(),
  }),
  fc.constant({ kind: 'save' as const }),
);

/** Applies one edit the way the editor's inputs do (level-row.tsx, attribute-card.tsx). */
function applyEdit(d: StudyDefinition, edit: Edit): StudyDefinition {
  const a = d.attributes[0];
  const setLevel = (i: number, f: (l: (typeof a.levels)[number]) => (typeof a.levels)[number]) => ({
    ...d,
    attributes: [{ ...a, levels: a.levels.map((l, k) => (k === i ? f(l) : l)) }],
  });
  switch (edit.kind) {
    case 'value':
      return setLevel(edit.level, (l) => ({ ...l, value: edit.value }));
    case 'unit':
      return { ...d, attributes: [{ ...a, unit: edit.unit }] };
    case 'confirm':
      return setLevel(edit.level, (l) => confirmLevelLabel(l, edit.on));
    case 'save':
      return d;
    case 'label':
      return setLevel(edit.level, (l) => {
        const v = l.value!;
        const text = {
          empty: '',
          derived: formatNumericLevel(v, a.unit),
          stale: formatNumericLevel(v + 1, a.unit),
          words: 'No change',
          writes: `${v} a month`,
        }[edit.text];
        return { ...l, label: text };
      });
  }
}

/** Save as the editor does, then load the stored JSON back as the editor does. */
function saveAndReload(draft: StudyDefinition): StudyDefinition {
  const stored = JSON.parse(
    JSON.stringify(studyDefinitionSchema.parse(normalizeDefinition(draft))),
  ) as StudyDefinition;
  return stored;
}

function mismatchPaths(stored: StudyDefinition): string[] {
  return checkReadiness({
    definition: stored,
    design: null,
    questionnaire: null,
    settings: { closeAt: null, quotaCompletes: null } as never,
    completes: 0,
    now: new Date(),
  })
    .filter((p) => p.code === 'level_label_mismatch')
    .map((p) => p.path);
}

describe('numeric level labels under any sequence of edits (property)', () => {
  it('never let respondents and the model disagree unnoticed', () => {
    fc.assert(
      fc.property(fc.array(editArbitrary, { minLength: 1, maxLength: 25 }), (edits) => {
        let draft = toDraftDefinition(start);
        // The model: the label each level's researcher typed, or null for "show the value".
        // Typing exactly what the value and unit give counts as no label of one's own.
        const own: (string | null)[] = [null, null, null];
        for (const edit of edits) {
          draft = applyEdit(draft, edit);
          if (edit.kind === 'label') {
            const text = draft.attributes[0].levels[edit.level].label;
            own[edit.level] = text === '' ? null : text;
          }
          if (edit.kind !== 'save') continue;
          const flagged = draft.attributes[0].levels
            .map((l, k) => (checkLevelLabel(draft.attributes[0], l) === 'drifted' ? k : -1))
            .filter((k) => k >= 0);
          const stored = saveAndReload(draft);
          const a = stored.attributes[0];
          const refused = mismatchPaths(stored);
          // The editor flags exactly the levels go-live refuses.
          expect(refused).toEqual(flagged.map((k) => `definition.attributes.0.levels.${k}.label`));
          a.levels.forEach((l, k) => {
            const derived = formatNumericLevel(l.value!, a.unit);
            if (own[k] === derived) own[k] = null;
            const shown = getLevelLabel(a, l);
            // Respondents see the researcher's own label, or the current value and unit.
            expect(shown).toBe(own[k] ?? derived);
            const agrees = labelShowsValue(shown, l.value!);
            const confirmed =
              l.labelConfirmed?.value === l.value && l.labelConfirmed?.label === l.label;
            const path = `definition.attributes.0.levels.${k}.label`;
            expect(agrees || confirmed || refused.includes(path)).toBe(true);
            if (refused.includes(path)) expect(agrees || confirmed).toBe(false);
          });
          // Saving what was loaded changes nothing; the draft continues from the stored copy.
          expect(saveAndReload(toDraftDefinition(stored))).toEqual(stored);
          draft = toDraftDefinition(stored);
        }
      }),
      { numRuns: 300, seed: 20270101 },
    );
  });
});
