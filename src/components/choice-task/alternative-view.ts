/**
 * What each alternative of a choice task shows, ready for either layout: its title, and per
 * attribute the level text (null where the attribute does not apply) and image. An opt-out
 * has no levels: it is offered as one compact choice rather than a column of dashes.
 */
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { formatLevel } from './format-level';

/** One alternative in display order: a designed one (its design index and levels) or the fixed one. */
export type ChoiceTaskAlternative =
  { kind: 'designed'; designIndex: number; levels: Record<string, string> } | { kind: 'fixed' };

export type AlternativeCell = { attributeId: string; text: string | null; image?: string };

export type AlternativeView = {
  /** Position on screen (what a choice sends). */
  position: number;
  title: string;
  optOut: boolean;
  cells: AlternativeCell[];
};

/** What either layout of a task (side by side, or stacked cards) is given. */
export type TaskLayoutProps = {
  attributes: StudyDefinition['attributes'];
  alternatives: AlternativeView[];
  selected: number | null;
  onChoose?: (position: number) => void;
  /** Name of the radio group (one per task on the page). */
  name: string;
  /** Id prefix for each alternative's spoken summary. */
  summaryId: (position: number) => string;
};

const LETTERS = 'ABCDE';

export function viewAlternatives(
  definition: Pick<StudyDefinition, 'attributes' | 'alternatives' | 'fixedAlternative'>,
  alternatives: ChoiceTaskAlternative[],
  imageUrl: (key: string) => string,
  /** The name of an unlabeled alternative in the respondent's language. */
  unlabeledName: (letter: string) => string = (letter) => `Option ${letter}`,
): AlternativeView[] {
  const fixed = definition.fixedAlternative;
  let designedShown = 0;
  return alternatives.map((alt, position) => {
    if (alt.kind === 'fixed') {
      const optOut = fixed?.kind !== 'status_quo';
      return {
        position,
        title: fixed?.label ?? 'None of these',
        optOut,
        cells: definition.attributes.map((a) => {
          const level = optOut ? undefined : a.levels.find((l) => l.id === fixed?.levels[a.id]);
          return {
            attributeId: a.id,
            text: level ? formatLevel(a, level) : null,
            image: level?.imageKey ? imageUrl(level.imageKey) : undefined,
          };
        }),
      };
    }
    const labeled = definition.alternatives.labeled;
    const shown = designedShown++;
    const name = labeled ? definition.alternatives.labels[alt.designIndex]?.name : undefined;
    const omitted = new Set(
      labeled ? (definition.alternatives.labels[alt.designIndex]?.omittedAttributeIds ?? []) : [],
    );
    return {
      position,
      title: name ?? unlabeledName(LETTERS[shown] ?? String(shown + 1)),
      optOut: false,
      cells: definition.attributes.map((a) => {
        const level = omitted.has(a.id)
          ? undefined
          : a.levels.find((l) => l.id === alt.levels[a.id]);
        return {
          attributeId: a.id,
          text: level ? formatLevel(a, level) : null,
          image: level?.imageKey ? imageUrl(level.imageKey) : undefined,
        };
      }),
    };
  });
}
