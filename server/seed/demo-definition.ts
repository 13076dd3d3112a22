/**
 * What the demo study asks (README.md, the demo study): five attributes of water-service
 * packages, two unlabeled packages plus the status quo, and the rule that every package costs
 * more than the current service. Pure data on shared/ only, so the study factory of the tests
 * and benchmarks (scripts/lib/study-factory) and a browser bundle can reuse it.
 */
import { studyDefinitionSchema, type StudyDefinition } from '../../shared/schemas/study-definition';

/** Numeric levels show the label derived from value and unit (no overrides). */
const numericLevels = (prefix: string, values: number[]) =>
  values.map((v) => ({ id: `${prefix}-${v}`, value: v }));

export const demoDefinition: StudyDefinition = studyDefinitionSchema.parse({
  attributes: [
    {
      id: 'bill',
      name: 'Monthly bill increase',
      description: 'Added to your household water bill every month for the next five years.',
      kind: 'numeric',
      unit: '€',
      isCost: true,
      coding: 'linear',
      levels: numericLevels('bill', [0, 3, 6, 10, 15]),
    },
    {
      id: 'interruptions',
      name: 'Supply interruptions per year',
      description: 'Unplanned times your tap runs dry for more than an hour.',
      kind: 'numeric',
      unit: 'per year',
      coding: 'linear',
      levels: numericLevels('interruptions', [4, 2, 1]),
    },
    {
      id: 'warnings',
      name: 'Days of taste/odour warnings per year',
      description: 'Days on which the utility advises that tap water may taste or smell unusual.',
      kind: 'numeric',
      unit: 'days',
      coding: 'linear',
      levels: numericLevels('warnings', [6, 2, 0]),
    },
    {
      id: 'river',
      name: 'River health rating',
      description: 'The state of the Larkspur river downstream of the treatment works.',
      kind: 'categorical',
      coding: 'dummy',
      referenceLevelId: 'river-poor',
      levels: [
        { id: 'river-poor', label: 'Poor' },
        { id: 'river-fair', label: 'Fair' },
        { id: 'river-good', label: 'Good' },
      ],
    },
    {
      id: 'renewable',
      name: 'Share of renewable pumping energy',
      kind: 'numeric',
      unit: '%',
      coding: 'linear',
      levels: numericLevels('renewable', [20, 50, 80]),
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: {
    kind: 'status_quo',
    label: 'Keep the current service',
    levels: {
      bill: 'bill-0',
      interruptions: 'interruptions-4',
      warnings: 'warnings-6',
      river: 'river-poor',
      renewable: 'renewable-20',
    },
  },
  // Every package the design offers costs more than the current service: a cheaper-or-equal
  // package that is better on every other attribute would be an easy, uninformative choice.
  excludedCombinations: [
    {
      id: 'bill-above-current',
      kind: 'versus_status_quo',
      attributeId: 'bill',
      relation: 'greater',
    },
  ],
});
