import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import type { PriorInputs } from '../utils/build-design-spec';
import { getPriorHint } from '../utils/prior-hints';
import { DataTable, figureHeading } from '@/components/ui/data-table';

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
    <DataTable
      look="flush"
      caption="Priors per coded column: what you expect each coefficient to be, in utility units."
      captionClassName="mb-2 text-left text-xs text-ink-muted"
      headCellClassName="py-2 pr-3 font-medium"
      headings={['Coded column', figureHeading('Mean'), bayesian && figureHeading('SD')]}
    >
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
            <PriorCell
              label={`Prior mean of ${c.name}`}
              value={values[c.key]?.mean ?? '0'}
              invalid={Boolean(meanError)}
              onChange={(text) => set(c.key, 'mean', text)}
            />
            {bayesian && (
              <PriorCell
                label={`Prior SD of ${c.name}`}
                value={values[c.key]?.sd ?? '0'}
                invalid={Boolean(sdError)}
                onChange={(text) => set(c.key, 'sd', text)}
              />
            )}
          </tr>
        );
      })}
    </DataTable>
  );
}

/** One prior value (a mean or an SD) as a cell of decimal input; its error shows by the name. */
function PriorCell({
  label,
  value,
  invalid,
  onChange,
}: {
  label: string;
  value: string;
  invalid: boolean;
  onChange: (text: string) => void;
}) {
  return (
    <td className="py-2 pr-3 text-right">
      <input
        aria-label={label}
        inputMode="decimal"
        className={cell}
        value={value}
        aria-invalid={invalid ? true : undefined}
        onChange={(e) => onChange(e.target.value)}
      />
    </td>
  );
}
