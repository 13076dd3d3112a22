/**
 * The rules a generated design keeps besides the study's excluded combinations: dominance
 * screening (each switchable) and how often levels appear. The diagnostics report every rule,
 * switched on or not.
 */
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { TextField } from '@/components/ui/field';
import { CheckboxField as Switch } from '@/components/ui/checkbox-field';
import type { DesignFormValues } from '../utils/build-design-spec';
import { designTextField, type DesignTextKey } from '../utils/design-text-field';

type Props = {
  definition: StudyDefinition;
  values: DesignFormValues;
  errors: Map<string, string>;
  onChange: (patch: Partial<DesignFormValues>) => void;
};

export function DesignRulesFields({ definition, values: v, errors, onChange }: Props) {
  const fixed = definition.fixedAlternative;
  const fixedName = fixed ? `“${fixed.label}”` : null;
  const dominance = (patch: Partial<DesignFormValues['dominance']>) =>
    onChange({ dominance: { ...v.dominance, ...patch } });
  const judged = v.method === 'd_efficient' && v.priorsKind !== 'zero';
  const text = (key: DesignTextKey, specPath: string) =>
    designTextField({ values: v, errors, onChange }, key, specPath);
  return (
    <div className="space-y-4">
      <fieldset className="space-y-1">
        <legend className="text-sm font-medium text-ink">Dominance screening</legend>
        <p className="text-xs text-ink-muted">
          One option dominates another when it is at least as good on every attribute and better on
          one, judged by the signs of your priors.{' '}
          {judged
            ? 'A sign counts as known when the prior puts at most 2.5 % of its mass on the other side.'
            : 'With zero priors no sign is known, so nothing can be screened; the diagnostics still count what they can.'}
        </p>
        <Switch
          label="No option dominates another option of its task"
          checked={v.dominance.betweenDesigned}
          onChange={(betweenDesigned) => dominance({ betweenDesigned })}
        />
        {fixedName && (
          <>
            <Switch
              label={`No option dominates ${fixedName}`}
              checked={v.dominance.overFixed}
              onChange={(overFixed) => dominance({ overFixed })}
            />
            <Switch
              label={`${fixedName} dominates no option`}
              checked={v.dominance.byFixed}
              onChange={(byFixed) => dominance({ byFixed })}
            />
          </>
        )}
      </fieldset>
      <fieldset className="space-y-2">
        <legend className="text-sm font-medium text-ink">Levels and overlap</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <TextField
            label="Each level appears at least"
            inputMode="numeric"
            hint="times over the whole design"
            {...text('minAppearances', 'balance.minAppearances')}
          />
          <TextField
            label="Attributes alike in all options of a task, at most"
            inputMode="numeric"
            hint="Leave empty for no limit"
            {...text('maxOverlap', 'balance.maxOverlap')}
          />
        </div>
        <Switch
          label="Balance levels: each level of an attribute equally often (within one)"
          checked={v.levelBalance}
          onChange={(levelBalance) => onChange({ levelBalance })}
        />
      </fieldset>
    </div>
  );
}
