/**
 * Convergence of an HB run: split R-hat and ESS of each population mean and variance (flagged
 * above the limit, never hidden), acceptance per chain (burn-in and kept draws; the proposal
 * adapts toward about 0.3 during burn-in), and trace plots of one parameter across the chains.
 */
import { useState } from 'react';
import type { RunResult } from '@shared/schemas/run';
import { Alert } from '@/components/ui/feedback';
import { SelectField } from '@/components/ui/field';
import { formatNumber, formatPercent } from '@/utils/format';
import { TraceChart } from './trace-chart';
import { DataTable, figureHeading } from '@/components/ui/data-table';
import { Options } from '@/components/ui/options';

/** ESS below this is too few draws to trust a posterior mean (common practice, no source). */
const ESS_LOW = 400;

type Diagnostics = NonNullable<RunResult['diagnostics']>;

export function HbDiagnostics({ results }: { results: RunResult }) {
  const d = results.diagnostics;
  if (!d) return null;
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  return (
    <div className="space-y-5">
      {d.flagged ? (
        <Alert tone="warning" title="The chains may not have converged">
          The largest split R-hat is {formatNumber(d.rhatMax, 3)}, above {d.rhatLimit}. Read the
          traces below; run more iterations or a longer burn-in before you rely on these estimates.
        </Alert>
      ) : (
        <p className="text-sm text-ink-soft">
          Largest split R-hat {formatNumber(d.rhatMax, 3)} (limit {d.rhatLimit}), smallest effective
          sample size {formatNumber(d.essMin, 0)}.
        </p>
      )}
      <RhatTable d={d} label={label} />
      <ChainTable d={d} />
      <Traces d={d} label={label} />
    </div>
  );
}

function RhatTable({ d, label }: { d: Diagnostics; label: Map<string, string> }) {
  return (
    <DataTable
      className="w-full min-w-[18rem] text-sm"
      caption="Split R-hat and effective sample size per parameter"
      headings={['Parameter', figureHeading('Split R-hat'), figureHeading('ESS')]}
    >
      {d.parameters.map((p) => {
        const [coef, ...rest] = p.name.split('.');
        const part = rest.join('.') === 'variance' ? 'variance' : 'mean';
        const high = p.rhat !== null && p.rhat > d.rhatLimit;
        const few = p.ess !== null && p.ess < ESS_LOW;
        return (
          <tr key={p.name} className="border-b border-line/60">
            <td className="px-2 py-1.5">
              {label.get(coef) ?? coef} <span className="text-xs text-ink-muted">{part}</span>
            </td>
            <td className={`num px-2 py-1.5 ${high ? 'font-semibold text-danger' : ''}`}>
              {formatNumber(p.rhat, 3)}
              {high && <span className="ml-1 text-xs">above {d.rhatLimit}</span>}
            </td>
            <td className={`num px-2 py-1.5 ${few ? 'font-semibold text-danger' : ''}`}>
              {formatNumber(p.ess, 0)}
              {few && <span className="ml-1 text-xs">few</span>}
            </td>
          </tr>
        );
      })}
    </DataTable>
  );
}

function ChainTable({ d }: { d: Diagnostics }) {
  const hasFixed = d.chains.some((c) => c.acceptanceFixed !== null);
  return (
    <div>
      <DataTable
        className="w-full min-w-[18rem] text-sm"
        caption="Acceptance rate per chain"
        headings={[
          'Chain',
          figureHeading('Acceptance, burn-in'),
          figureHeading('Acceptance, kept'),
          hasFixed && figureHeading('Fixed coefficients'),
          figureHeading('Proposal scale'),
        ]}
      >
        {d.chains.map((c) => (
          <tr key={c.chain} className="border-b border-line/60">
            <td className="px-2 py-1.5">{c.chain}</td>
            <td className="num px-2 py-1.5">{formatPercent(c.acceptanceBurnin)}</td>
            <td className="num px-2 py-1.5">{formatPercent(c.acceptance)}</td>
            {hasFixed && <td className="num px-2 py-1.5">{formatPercent(c.acceptanceFixed)}</td>}
            <td className="num px-2 py-1.5">{formatNumber(c.scale, 3)}</td>
          </tr>
        ))}
      </DataTable>
      <p className="mt-1 text-xs text-ink-muted">
        The respondent-level proposal adapts during burn-in toward an acceptance of about 30 %, then
        stays fixed.
      </p>
    </div>
  );
}

function Traces({ d, label }: { d: Diagnostics; label: Map<string, string> }) {
  const names = Object.keys(d.chains[0]?.trace.mean ?? {});
  const [name, setName] = useState(names[0] ?? '');
  const [part, setPart] = useState<'mean' | 'variance' | 'acceptance'>('mean');
  if (names.length === 0) return null;
  const series = d.chains.map((c) => ({
    chain: c.chain,
    iteration: c.trace.iteration,
    values: part === 'acceptance' ? c.trace.acceptance : (c.trace[part][name] ?? []),
  }));
  const title =
    part === 'acceptance'
      ? 'Acceptance rate'
      : `${part === 'mean' ? 'Population mean' : 'Population variance'} of ${label.get(name) ?? name}`;
  return (
    <div className="space-y-2">
      <div className="grid gap-3 sm:grid-cols-2">
        <SelectField
          label="Trace of"
          value={part}
          onChange={(e) => setPart(e.target.value as typeof part)}
        >
          <option value="mean">Population mean μ</option>
          <option value="variance">Population variance Σ (diagonal)</option>
          <option value="acceptance">Acceptance rate</option>
        </SelectField>
        {part !== 'acceptance' && (
          <SelectField label="Coefficient" value={name} onChange={(e) => setName(e.target.value)}>
            <Options items={names.map((n) => ({ value: n, label: label.get(n) ?? n }))} />
          </SelectField>
        )}
      </div>
      <TraceChart title={title} series={series} />
    </div>
  );
}
