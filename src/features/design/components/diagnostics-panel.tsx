import type { DesignDiagnostics } from '@shared/schemas/design-diagnostics';
import { Alert, Card } from '@/components/ui/feedback';
import { ChoiceProbabilities, Correlations, SampleSizeGuide } from './diagnostics-details';
import { RuleReportCard } from './rule-report-card';
import { CriteriaList } from './criteria-card';
import { criterionNames } from '../utils/criterion-names';
import { formatSignificant } from '@/utils/format';

const pct = (v: number | null) => (v === null ? '—' : `${Math.round(v * 100)} %`);

/** How good the design is: criteria, balance, overlap, correlations, probabilities, sample size. */
export function DiagnosticsPanel({
  d,
  alternativeNames,
  fixedLabel,
}: {
  d: DesignDiagnostics;
  /** Names of the alternatives in task order (designed ones, then opt-out / status quo). */
  alternativeNames: string[];
  /** Name of the opt-out / status quo, or null when there is none. */
  fixedLabel: string | null;
}) {
  return (
    <div className="space-y-4">
      <Card title="Design quality">
        <dl className="grid grid-cols-2 gap-3 text-sm">
          <div>
            <dt className="text-xs text-ink-muted">{criterionNames[d.priorsKind]}</dt>
            <dd className="font-mono text-xl font-semibold tabular-nums text-ink">
              {formatSignificant(d.dError)}
            </dd>
          </div>
          <div>
            <dt className="text-xs text-ink-muted">D-efficiency</dt>
            <dd className="font-mono text-xl font-semibold tabular-nums text-ink">
              {d.dEfficiency ? pct(d.dEfficiency.efficiency) : '—'}
            </dd>
            {!d.dEfficiency && (
              <dd className="text-xs text-ink-muted">No known optimum for this set-up.</dd>
            )}
          </div>
          {d.priorsKind !== 'zero' && (
            <div>
              <dt className="text-xs text-ink-muted">{criterionNames.zero}</dt>
              <dd className="font-mono tabular-nums">{formatSignificant(d.dErrorZero)}</dd>
            </div>
          )}
          <div>
            <dt className="text-xs text-ink-muted">Parameters · tasks · blocks</dt>
            <dd className="font-mono tabular-nums">
              {d.parameters} · {d.tasks} · {d.blocks}
            </dd>
          </div>
        </dl>
        <div className="mt-4">
          <CriteriaList d={d} />
        </div>
        {d.warnings.length > 0 && (
          <Alert tone="warning" className="mt-4">
            <ul className="list-disc space-y-1 pl-4">
              {d.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          </Alert>
        )}
      </Card>

      <RuleReportCard d={d} fixedLabel={fixedLabel} />

      <Card title="Level balance and overlap">
        <div className="space-y-4">
          {d.levelBalance.map((a) => {
            const overlap = d.overlap.find((o) => o.attributeId === a.attributeId);
            const max = Math.max(...a.levels.map((l) => l.count), 1);
            return (
              <div key={a.attributeId}>
                <div className="mb-1 flex items-baseline justify-between gap-2 text-sm">
                  <span className="font-medium text-ink">{a.name}</span>
                  <span className="text-xs text-ink-muted">
                    same level in all alternatives:{' '}
                    <span className="num">{pct(overlap?.share ?? null)}</span> of tasks
                  </span>
                </div>
                <ul className="space-y-1">
                  {a.levels.map((l) => (
                    <li
                      key={l.levelId}
                      className="grid grid-cols-[7rem_1fr_2.5rem] items-center gap-2 text-xs"
                    >
                      <span className="truncate text-ink-soft">
                        {l.label}
                        {/* Stored designs from before this flag lack it. */}
                        {l.inStatusQuo === true && (
                          <span className="ml-1 text-ink-muted" title="The status quo's level">
                            (status quo)
                          </span>
                        )}
                      </span>
                      <span className="h-2 rounded-full bg-line">
                        <span
                          className="block h-2 rounded-full bg-oi-blue"
                          style={{ width: `${(l.count / max) * 100}%` }}
                        />
                      </span>
                      <span className="num">{l.count}</span>
                    </li>
                  ))}
                </ul>
              </div>
            );
          })}
        </div>
      </Card>

      <Card title="Correlations between coded columns">
        <Correlations d={d} />
      </Card>
      <Card title="Choice probabilities under the priors">
        <ChoiceProbabilities d={d} alternativeNames={alternativeNames} />
      </Card>
      <Card title="Sample-size guide">
        <SampleSizeGuide d={d} />
      </Card>
    </div>
  );
}
