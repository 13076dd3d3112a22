import type { PriorSpread, RunPriors } from '@shared/schemas/redesign';
import { SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { ApiError } from '@/lib/api-client';
import { formatSignificant } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

export type PriorRunOption = { id: string; name: string; model: 'mnl' | 'mixed' };

type Props = {
  runs: PriorRunOption[];
  runId: string;
  spread: PriorSpread;
  onRunChange: (runId: string) => void;
  onSpreadChange: (spread: PriorSpread) => void;
  priors: RunPriors | undefined;
  error: unknown;
  loading: boolean;
  onUse: (priors: RunPriors) => void;
};

/**
 * Pilot → priors: pick a finished MNL or mixed-logit run, see its estimates as normal priors
 * (mean = estimate, SD = standard error or population SD), and put them into the design form.
 */
export function RunPriorsCard(p: Props) {
  const run = p.runs.find((r) => r.id === p.runId);
  const fieldError =
    p.error instanceof ApiError ? p.error.fields?.find((f) => f.path === 'runId')?.message : null;
  const spreadError =
    p.error instanceof ApiError ? p.error.fields?.find((f) => f.path === 'spread')?.message : null;
  return (
    <Card title="Priors from a run">
      <p className="mb-3 text-sm text-ink-soft">
        Use a pilot’s estimates as Bayesian priors: each coefficient’s estimate becomes the prior
        mean, its uncertainty the prior SD.
      </p>
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Run"
          value={p.runId}
          error={fieldError ?? undefined}
          onChange={(e) => p.onRunChange(e.target.value)}
        >
          <option value="">Choose a finished run</option>
          {p.runs.map((r) => (
            <option key={r.id} value={r.id}>
              {r.name} ({r.model === 'mnl' ? 'MNL' : 'mixed logit'})
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Prior SD"
          value={p.spread}
          error={spreadError ?? undefined}
          hint={
            p.spread === 'se'
              ? 'How uncertain the estimate is.'
              : 'How much tastes vary between people (random coefficients).'
          }
          onChange={(e) => p.onSpreadChange(e.target.value as PriorSpread)}
        >
          <option value="se">Standard error of the estimate</option>
          <option value="population" disabled={run?.model === 'mnl'}>
            Population SD (mixed logit)
          </option>
        </SelectField>
      </div>
      {p.error && !fieldError && !spreadError ? <ErrorText error={p.error} /> : null}
      {p.loading && <p className="mt-3 text-sm text-ink-muted">Reading the run…</p>}
      {p.priors && (
        <div className="mt-4 space-y-3">
          <DataTable
            look="flush"
            label="Priors from the run"
            headings={['Coded column', figureHeading('Mean'), figureHeading('SD')]}
          >
            {p.priors.columns.map((c) => (
              <tr key={c.key} className="border-b border-line/60">
                <td className="py-1.5 pr-3 text-ink-soft">{c.name}</td>
                <td className="num py-1.5 pr-3 text-right">{formatSignificant(c.mean, 3)}</td>
                <td className="num py-1.5 text-right">
                  {formatSignificant(c.sd, 3)}
                  {p.spread === 'population' && c.spreadFrom === 'se' && (
                    <span className="ml-1 text-xs text-ink-muted" title="Fixed coefficient">
                      (SE)
                    </span>
                  )}
                </td>
              </tr>
            ))}
          </DataTable>
          <Button type="button" variant="secondary" onClick={() => p.onUse(p.priors!)}>
            Use these priors in the design settings
          </Button>
        </div>
      )}
    </Card>
  );
}
