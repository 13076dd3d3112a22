/**
 * The run form's hierarchical Bayes settings: sampler (iterations, burn-in, thinning, MH steps
 * per respondent, chains, seed), correlation of the random tastes, and the priors, with a note on how the attributes'
 * coding and scale interact with them.
 */
import { SelectField } from '@/components/ui/field';
import { FormTextFields, type TextFieldSpec } from '@/components/ui/form-text-fields';
import { HB_DEFAULTS_TEXT, type RunFormValues } from '../utils/run-form-values';
import { CorrelatedTastesField } from './correlated-tastes-field';
import { formField, type BoundForm } from '@/components/ui/form-field';

const samplerFields: TextFieldSpec<RunFormValues>[] = [
  {
    name: 'mcmcIterations',
    label: 'Iterations per chain',
    hint: 'Burn-in included',
    number: 'whole',
  },
  {
    name: 'mcmcBurnin',
    label: 'Burn-in',
    hint: 'Empty: half the iterations',
    type: 'number',
    inputMode: 'numeric',
  },
  { name: 'mcmcThin', label: 'Keep every n-th draw', number: 'whole' },
  {
    name: 'mcmcSteps',
    label: 'MH steps per respondent',
    hint: 'Per iteration; more steps mix the population means better, at a proportional cost',
    number: 'whole',
  },
  {
    name: 'mcmcChains',
    label: 'Chains',
    hint: 'Run in parallel, each with its own seed stream',
    number: 'whole',
  },
  { name: 'seed', label: 'Seed', number: 'whole' },
];

const priorFields: TextFieldSpec<RunFormValues>[] = [
  {
    name: 'priorMuVariance',
    label: 'Prior variance of the population means μ',
    hint: 'μ ~ N(0, variance·I); 100 is diffuse for coefficients of order 1',
    number: 'decimal',
  },
];

export function HbFields({ form }: { form: BoundForm<RunFormValues> }) {
  return (
    <>
      <fieldset className="grid gap-4 sm:grid-cols-3">
        <legend className="mb-2 text-sm font-medium text-ink">Sampler</legend>
        <FormTextFields form={form} fields={samplerFields} />
        <CorrelatedTastesField form={form} label="Correlated random tastes" />
        <p className="text-xs text-ink-muted sm:col-span-3">
          Defaults: {HB_DEFAULTS_TEXT}. The population means are drawn from the respondents&apos;
          current tastes, so they move only as fast as those do: one MH step per respondent leaves
          them slow to mix, and several steps per iteration help. After the run, check that every
          mean has R-hat below 1.05 and an effective sample size above 400; if not, run longer.
        </p>
      </fieldset>
      <fieldset className="grid gap-4 sm:grid-cols-2">
        <legend className="mb-2 text-sm font-medium text-ink">Priors</legend>
        <SelectField label="Prior on the covariance Σ" {...formField(form, 'priorPreset')}>
          <option value="rossi">Inverse Wishart IW(K+3, (K+3)·I), Rossi et al. 2005</option>
          <option value="train">Inverse Wishart IW(K, K·I), Train 2009</option>
        </SelectField>
        <FormTextFields form={form} fields={priorFields} />
        <p className="text-xs text-ink-muted sm:col-span-2">
          The priors act on the coefficients as coded. Dummy- and effects-coded levels are
          differences on the utility scale, usually of order 1, where these priors are weak. A
          linear attribute is per unit: a cost in single currency units gets a coefficient far below
          1, and the inverse Wishart prior, centred on variances near 1, then pulls its spread
          upward. Rescale such attributes (for example per 10 or per 100) before you rely on HB
          spreads, and keep the coding the same when you compare HB with the mixed logit. K is the
          number of random coefficients.
        </p>
      </fieldset>
    </>
  );
}
