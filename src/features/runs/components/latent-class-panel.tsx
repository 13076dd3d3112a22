/**
 * A latent class run: the class sizes (shares with SEs from the observed-data information),
 * each class's taste profile side by side (estimates with SEs, WTP where there is a cost), the
 * membership model when background answers were used, and the class-count table to choose from.
 */
import type { RunResult } from '@shared/schemas/run';
import { formatNumber, formatPercent } from '@/utils/format';
import { DataTable, figureHeading } from '@/components/ui/data-table';

type LcClass = NonNullable<RunResult['classes']>[number];

function Estimate({ e }: { e: { estimate: number; se: number | null } | undefined }) {
  if (!e) return <td className="num px-2 py-1.5">—</td>;
  return (
    <td className="num px-2 py-1.5">
      {formatNumber(e.estimate, 3)}
      <span className="block text-xs text-ink-muted">SE {formatNumber(e.se, 3)}</span>
    </td>
  );
}

function ClassSizes({ classes }: { classes: LcClass[] }) {
  return (
    <ul className="space-y-2" aria-label="Class sizes">
      {classes.map((c) => (
        <li key={c.class} className="grid grid-cols-[5rem_1fr_7rem] items-center gap-3 text-sm">
          <span className="text-ink">Class {c.class}</span>
          <span className="h-3 rounded-sm bg-primary-soft">
            <span
              className="block h-3 rounded-sm bg-primary"
              style={{ width: `${Math.max(1, c.share * 100)}%` }}
            />
          </span>
          <span className="num text-ink">
            {formatPercent(c.share)}
            <span className="block text-xs text-ink-muted">SE {formatPercent(c.shareSe)}</span>
          </span>
        </li>
      ))}
    </ul>
  );
}

function ClassProfiles({ results, classes }: { results: RunResult; classes: LcClass[] }) {
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  const names = classes[0]?.estimates.map((e) => e.name) ?? [];
  const wtpNames = classes[0]?.wtp?.map((w) => w.name) ?? [];
  const head = (
    <tr className="border-b border-line text-left text-xs text-ink-muted">
      <th className="px-2 py-1.5 font-medium">Coefficient</th>
      {classes.map((c) => (
        <th key={c.class} className="num px-2 py-1.5 font-medium">
          Class {c.class} ({formatPercent(c.share, 0)})
        </th>
      ))}
    </tr>
  );
  return (
    <div className="overflow-x-auto">
      <table className="w-full min-w-[24rem] text-sm">
        <caption className="sr-only">Estimates of each class</caption>
        <thead>{head}</thead>
        <tbody>
          {names.map((n) => (
            <tr key={n} className="border-b border-line/60">
              <th scope="row" className="px-2 py-1.5 text-left font-normal">
                {label.get(n) ?? n}
              </th>
              {classes.map((c) => (
                <Estimate key={c.class} e={c.estimates.find((e) => e.name === n)} />
              ))}
            </tr>
          ))}
          {wtpNames.map((n) => (
            <tr key={`wtp-${n}`} className="border-b border-line/60">
              <th scope="row" className="px-2 py-1.5 text-left font-normal">
                WTP {label.get(n) ?? n}
              </th>
              {classes.map((c) => (
                <Estimate key={c.class} e={c.wtp?.find((e) => e.name === n)} />
              ))}
            </tr>
          ))}
          {classes.slice(1).some((c) => c.membership.length > 0) &&
            classes[1].membership.map((m) => (
              <tr key={`m-${m.name}`} className="border-b border-line/60">
                <th scope="row" className="px-2 py-1.5 text-left font-normal">
                  Membership: {m.name}
                </th>
                {classes.map((c) => (
                  <Estimate key={c.class} e={c.membership.find((e) => e.name === m.name)} />
                ))}
              </tr>
            ))}
        </tbody>
      </table>
      <p className="mt-1 text-xs text-ink-muted">
        SEs from the observed-data information matrix (Louis&apos;s identity), not the EM
        complete-data one.
        {classes.slice(1).some((c) => c.membership.length > 0) &&
          ' Membership coefficients are against class 1.'}
      </p>
    </div>
  );
}

function ClassSelection({
  rows,
  chosen,
}: {
  rows: NonNullable<RunResult['classSelection']>;
  chosen: number;
}) {
  const best = (key: 'aic' | 'bic' | 'caic') => {
    const ok = rows.filter((r) => r[key] !== null);
    return ok.length
      ? ok.reduce((a, b) => ((b[key] as number) < (a[key] as number) ? b : a)).classes
      : null;
  };
  const lowest = { aic: best('aic'), bic: best('bic'), caic: best('caic') };
  const cell = (r: (typeof rows)[number], key: 'aic' | 'bic' | 'caic') => (
    <td
      className={`num px-2 py-1.5 ${lowest[key] === r.classes ? 'font-semibold text-primary' : ''}`}
    >
      {formatNumber(r[key], 1)}
    </td>
  );
  return (
    <div>
      <DataTable
        className="w-full min-w-[30rem] text-sm"
        caption="Fit by number of classes"
        headings={[
          'Classes',
          ...['LL', 'Parameters', 'AIC', 'BIC', 'CAIC', 'Starts at best LL'].map((h) =>
            figureHeading(h),
          ),
        ]}
      >
        {rows.map((r) => (
          <tr
            key={r.classes}
            className={`border-b border-line/60 ${r.classes === chosen ? 'bg-primary-soft/60' : ''}`}
          >
            <td className="px-2 py-1.5">
              {r.classes}
              {r.classes === chosen && <span className="ml-1 text-xs text-ink-muted">shown</span>}
              {r.reason && <span className="block text-xs text-danger">{r.reason}</span>}
            </td>
            <td className="num px-2 py-1.5">{formatNumber(r.loglik, 2)}</td>
            <td className="num px-2 py-1.5">{r.parameters}</td>
            {cell(r, 'aic')}
            {cell(r, 'bic')}
            {cell(r, 'caic')}
            <td className="num px-2 py-1.5">
              {r.bestStarts} of {r.starts}
            </td>
          </tr>
        ))}
      </DataTable>
      <p className="mt-1 text-xs text-ink-muted">
        Lowest value of each criterion in bold. BIC and CAIC penalise extra classes more than AIC; a
        class count whose best LL was reached by few starts may be a local optimum.
      </p>
    </div>
  );
}

export function LatentClassPanel({ results }: { results: RunResult }) {
  const classes = results.classes ?? [];
  if (classes.length === 0) return null;
  return (
    <div className="space-y-5">
      <ClassSizes classes={classes} />
      <ClassProfiles results={results} classes={classes} />
      {(results.classSelection?.length ?? 0) > 1 && (
        <section aria-labelledby="class-count-heading" className="space-y-2">
          <h4 id="class-count-heading" className="text-sm font-semibold text-ink">
            How many classes
          </h4>
          <ClassSelection rows={results.classSelection ?? []} chosen={classes.length} />
        </section>
      )}
    </div>
  );
}
