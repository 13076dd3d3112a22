import type { DesignDiagnostics } from '@shared/schemas/design-diagnostics';
import { Alert } from '@/components/ui/feedback';
import { cn } from '@/lib/cn';
import { formatNumber } from '@/utils/format';

const ALT_COLOURS = [
  'bg-oi-blue',
  'bg-oi-orange',
  'bg-oi-green',
  'bg-oi-purple',
  'bg-oi-sky',
  'bg-oi-vermillion',
];

export function Correlations({ d }: { d: DesignDiagnostics }) {
  return (
    <div className="overflow-x-auto">
      <table className="text-xs">
        <thead>
          <tr>
            <th />
            {d.columns.map((c, j) => (
              <th key={c.key} className="num px-1 font-medium text-ink-muted" title={c.name}>
                {j + 1}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {d.columns.map((c, i) => (
            <tr key={c.key}>
              <th
                className="max-w-48 truncate pr-2 text-left font-normal text-ink-soft"
                title={c.name}
              >
                <span className="num mr-1 text-ink-muted">{i + 1}</span>
                {c.name}
              </th>
              {d.correlations[i].map((r, j) => (
                <td
                  key={j}
                  className={cn(
                    'num px-1 py-0.5',
                    i === j
                      ? 'text-ink-muted'
                      : r !== null && Math.abs(r) >= 0.3
                        ? 'bg-accent-soft font-semibold'
                        : '',
                  )}
                >
                  {i === j ? '·' : r === null ? '—' : formatNumber(r, 2)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <p className="mt-2 text-xs text-ink-muted">
        Shaded: |r| ≥ 0.30 (product default; judge correlations against your analysis plan).
      </p>
    </div>
  );
}

export function ChoiceProbabilities({
  d,
  alternativeNames,
}: {
  d: DesignDiagnostics;
  alternativeNames: string[];
}) {
  if (d.priorsKind === 'zero')
    return (
      <p className="text-sm text-ink-soft">With zero priors every alternative is equally likely.</p>
    );
  return (
    <div>
      <ul className="mb-2 flex flex-wrap gap-x-4 gap-y-1 text-xs text-ink-soft" aria-label="Legend">
        {alternativeNames.map((name, j) => (
          <li key={name} className="flex items-center gap-1">
            <span
              aria-hidden
              className={cn('inline-block size-3 rounded-sm', ALT_COLOURS[j % ALT_COLOURS.length])}
            />
            {name}
          </li>
        ))}
      </ul>
      <ul className="space-y-1">
        {d.choiceProbabilities.map((t) => {
          const dominant = Math.max(...t.probabilities) >= 0.9;
          return (
            <li key={t.task} className="grid grid-cols-[3.5rem_1fr] items-center gap-2 text-xs">
              <span className="num text-ink-muted">
                {t.task}
                {dominant && (
                  <span className="ml-1 text-danger" title="One alternative takes 90 % or more">
                    !
                  </span>
                )}
              </span>
              <span
                className="flex h-4 overflow-hidden rounded"
                aria-label={`Task ${t.task}: ${t.probabilities.map((p) => `${Math.round(p * 100)} %`).join(', ')}`}
              >
                {t.probabilities.map((p, j) => (
                  <span
                    key={j}
                    className={ALT_COLOURS[j % ALT_COLOURS.length]}
                    style={{ width: `${p * 100}%` }}
                  />
                ))}
              </span>
            </li>
          );
        })}
      </ul>
      <p className="mt-2 text-xs text-ink-muted">
        Each bar splits 100 % between the alternatives of a task. “!” marks a task where one
        alternative takes 90 % or more — it tells little about trade-offs.
      </p>
    </div>
  );
}

/** N ≥ 500·c/(t·a) with this design's numbers (de Bekker-Grob et al. 2015). */
function LevelCountFloor({ d }: { d: DesignDiagnostics }) {
  const { respondents, c, t, a } = d.sampleSize.ruleOfThumb;
  return (
    <p className="text-sm text-ink-soft">
      Floor for every level to be seen about 500 times: N ≥ 500·c/(t·a) ={' '}
      <span className="num">
        500·{c}/({t}·{a})
      </span>{' '}
      → <strong className="num">{respondents}</strong> respondents (c: most levels of an attribute,
      t: tasks per respondent, a: options per task; de Bekker-Grob et al. 2015, The Patient). A
      floor, not a power calculation.
    </p>
  );
}

export function SampleSizeGuide({ d }: { d: DesignDiagnostics }) {
  const s = d.sampleSize;
  return (
    <div className="space-y-3">
      {d.priorsKind === 'zero' ? (
        <>
          <p className="text-sm text-ink-soft">The per-coefficient guide needs non-zero priors.</p>
          <LevelCountFloor d={d} />
        </>
      ) : (
        <>
          <p className="text-sm text-ink">
            About <strong className="num">{s.sEstimateRespondents ?? '—'}</strong> respondents for
            every coefficient’s expected t-ratio to reach 1.96; about{' '}
            <strong className="num">{s.powerRespondents ?? '—'}</strong> for 80 % power.
          </p>
          <LevelCountFloor d={d} />
          <div className="overflow-x-auto">
            <table className="w-full text-xs">
              <thead>
                <tr className="border-b border-line text-left text-ink-muted">
                  <th className="py-1 pr-2 font-medium">Coefficient</th>
                  <th className="py-1 pr-2 text-right font-medium">Prior</th>
                  <th className="py-1 pr-2 text-right font-medium">Respondents (t = 1.96)</th>
                </tr>
              </thead>
              <tbody>
                {s.coefficients.map((c) => (
                  <tr key={c.key} className="border-b border-line/50">
                    <td className="py-1 pr-2">{c.name}</td>
                    <td className="num py-1 pr-2">{c.prior}</td>
                    <td className="num py-1 pr-2">
                      {c.replicationsForT === null ? '—' : Math.ceil(c.replicationsForT) * d.blocks}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </>
      )}
      <Alert tone="warning">
        A guide, not a guarantee: it assumes the priors are right and the MNL model holds. Plan for
        more respondents, and follow your ethics board and local data-protection law when surveying
        people.
      </Alert>
    </div>
  );
}
