import type { StudyDefinition } from '@shared/schemas/study-definition';
import type { FieldErrors } from './field-errors';

/**
 * What each section of the definition editor (alternatives, fixed alternative, excluded
 * combinations) is given: the whole definition, its field errors by path, whether it may be
 * edited, and where the edited definition goes.
 */
export type DefinitionSectionProps = {
  definition: StudyDefinition;
  errors: FieldErrors;
  readOnly: boolean;
  onChange: (d: StudyDefinition) => void;
};
