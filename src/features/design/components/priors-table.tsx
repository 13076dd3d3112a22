import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import type { PriorInputs } from '../utils/build-design-spec';
import { getPriorHint } from '../utils/prior-hints';

type Props = {
  definition: StudyDefinition;
  columns: CodedColumn[];
  bayesian: boolean;
  values: PriorInputs;
  errors: Map<string, string>;
  onChange: (v: PriorInputs) => void;
};

const cell =
  'num h-9 w-24 rounded-md border border-line bg-white px-2 text-sm focus:border-primary focus:outline-none focus:ring-2 focus:ring-primary/20 aria-[invalid=true]:border-danger';

/** One row per coded column of the study (from the shared coding module). */
export function PriorsTable({ definition, columns, bayesian, values, errors, onChange }: Props) {
  const set = (key: string, field: 'mean' | 'sd', text: string) =>
    onChange({
      ...values,
      [key]: { mean: values[key]?.mean ?? '0', sd: values[key]?.sd ?? '0', [field]: text },
    });
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm">
        <caption className="mb-2 text-left text-xs text-ink-muted">
          Priors per coded column: what you expect each coefficient to be, in utility units.
        </caption>
        <thead>
          <tr className="border-b border-line text-left text-xs text-ink-muted">
            <th className="py-2 pr-3 font-medium">Coded column</th>
            <th className="py-2 pr-3 text-right font-medium">Mean</th>
            {bayesian && <th className="py-2 pr-3 text-right font-medium">SD</th>}
          </tr>
        </thead>
        <tbody>
          {columns.map((c, i) => {
            const meanError = errors.get(`priors.columns.${i}.mean`);
            const sdError = errors.get(`priors.columns.${i}.sd`);
            return (
              <tr key={c.key} className="border-b border-line/60 align-top">
                <td className="py-2 pr-3">
                  <div className="font-medium text-ink">{c.name}</div>
                  <div className="text-xs text-ink-muted">{getPriorHint(definition, c)}</div>
                  {(meanError || sdError) && (
                    <div role="alert" className="text-xs text-danger">
                      {meanError ?? sdError}
                    </div>
                  )}
                </td>
                <td className="py-2 pr-3 text-right">
                  <input
                    aria-label={`Prior mean of ${c.name}`}
                    inputMode="decimal"
                    className={cell}
                    value={values[c.key]?.mean ?? '0'}
                    aria-invalid={meanError ? true : undefined}
                    onChange={(e) => set(c.key, 'mean', e.target.value)}
                  />
                </td>
                {bayesian && (
                  <td className="py-2 pr-3 text-right">
                    <input
                      aria-label={`Prior SD of ${c.name}`}
                      inputMode="decimal"
                      className={cell}
                      value={values[c.key]?.sd ?? '0'}
                      aria-invalid={sdError ? true : undefined}
                      onChange={(e) => set(c.key, 'sd', e.target.value)}
                    />
                  </td>
                )}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
