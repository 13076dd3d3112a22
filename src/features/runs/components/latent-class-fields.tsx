/**
 * The run form's latent class settings: one class count or a range (each count is fitted and
 * the table shows LL, parameters, AIC, BIC and CAIC; the lowest BIC is shown), the EM starts,
 * the seed of the random starts, and the background questions class membership may depend on
 * (single choice and numbers; the coding and the missing-answer rule are stated beside them).
 */
import { TextField } from '@/components/ui/field';
import { LATENT_CLASS_MAX, MEMBERSHIP_MAX_OPTIONS } from '@shared/schemas/estimation-families';
import type { MembershipQuestionOption } from '@shared/schemas/run';
import type { RunFormValues } from '../utils/run-form-values';
import { formNumberField, type BoundForm } from '@/components/ui/form-field';

export function LatentClassFields({
  form,
  questions,
}: {
  form: BoundForm<RunFormValues>;
  questions: MembershipQuestionOption[];
}) {
  return (
    <fieldset className="grid gap-4 sm:grid-cols-4">
      <legend className="mb-2 text-sm font-medium text-ink">Classes</legend>
      <TextField label="Fewest classes" {...formNumberField(form, 'classesMin')} />
      <TextField
        label="Most classes"
        hint={`Up to ${LATENT_CLASS_MAX}`}
        {...formNumberField(form, 'classesMax')}
      />
      <TextField label="EM starts per class count" {...formNumberField(form, 'starts')} />
      <TextField label="Seed" {...formNumberField(form, 'seed')} />
      <p className="text-xs text-ink-muted sm:col-span-4">
        Each class count in the range is fitted from every start; the run reports the one with the
        lowest BIC and a table of LL, parameters, AIC, BIC and CAIC so you can choose another. More
        classes than the data can identify end the run with the reason.
      </p>
      <fieldset className="sm:col-span-4" aria-describedby="membership-help">
        <legend className="mb-1 text-sm font-medium text-ink">
          Class membership depends on (optional)
        </legend>
        {questions.length === 0 ? (
          <p className="text-sm text-ink-soft">
            This study has no single-choice or number background questions; class shares are the
            same for everyone.
          </p>
        ) : (
          <ul className="grid gap-2 sm:grid-cols-2">
            {questions.map((q) => (
              <li key={q.key}>
                <label className="flex items-start gap-2 text-sm text-ink">
                  <input
                    type="checkbox"
                    value={q.key}
                    className="mt-0.5 size-4 shrink-0 accent-primary"
                    {...form.register('membership')}
                  />
                  <span className="min-w-0 break-words">
                    {q.text}{' '}
                    <span className="text-ink-muted">
                      ({q.type === 'single' ? `${q.optionCount} options` : 'number'})
                    </span>
                  </span>
                </label>
              </li>
            ))}
          </ul>
        )}
        {form.formState.errors.membership?.message && (
          <p role="alert" className="mt-1 text-xs font-medium text-danger">
            {form.formState.errors.membership.message}
          </p>
        )}
        <p id="membership-help" className="mt-2 text-xs text-ink-muted">
          Without questions every respondent has the same class shares. A single-choice question
          enters as one yes/no column per answer against the first answer given in the run; a number
          enters as it is. A respondent who skipped a question is kept: a &ldquo;not answered&rdquo;
          column is added (a number also takes the mean of the answers). Free-text and
          multiple-choice questions, and single choices with more than {MEMBERSHIP_MAX_OPTIONS}{' '}
          options, cannot be used.
        </p>
      </fieldset>
    </fieldset>
  );
}
