/**
 * The profile table: one row per respondent, each conditional mean with its conditional SD
 * beside it (HB: posterior mean, SD and 95 % interval; latent class: the likeliest class),
 * WTP, effective draws (flagged when few), quality flags and background answers.
 * Sorting and paging happen on the server; headers of means are sort buttons too.
 */
import { Link } from 'react-router';
import { PageButtons } from '@/components/ui/pagination';
import type { TasteList } from '@shared/schemas/tastes';
import type { TastesQuery } from '../api/list-tastes';
import { formatNumber } from '@/utils/format';

/** What the profile's `effectiveDraws` measures in each family (shared tasteProfileSchema). */
const drawsLabel: Record<TasteList['run']['model'], string> = {
  mnl: 'Effective draws',
  mixed: 'Effective draws',
  hb: 'Smallest ESS',
  latent_class: 'Effective classes',
};

const th = 'whitespace-nowrap px-3 py-2 text-left text-xs font-semibold text-ink-soft';
const num = 'px-3 py-2 text-right font-mono tabular-nums whitespace-nowrap';

export function TastesTable({
  data,
  query,
  onChange,
  respondentHref,
}: {
  data: TasteList;
  query: TastesQuery;
  onChange: (patch: Partial<TastesQuery>) => void;
  respondentHref: (respondentId: string) => string;
}) {
  const pages = Math.max(1, Math.ceil(data.total / data.pageSize));
  const sortBy = (sort: string) =>
    onChange({
      sort,
      dir: query.sort === sort && query.dir === 'asc' ? 'desc' : 'asc',
      page: 1,
    });
  const ariaSort = (sort: string) =>
    query.sort === sort ? (query.dir === 'asc' ? 'ascending' : 'descending') : undefined;
  const latentClass = data.run.model === 'latent_class';
  const wtpLabel = (n: string) => data.coefficients.find((c) => c.name === n)?.label ?? n;

  return (
    <div>
      <div className="overflow-x-auto rounded-lg border border-line bg-white">
        <table className="min-w-full text-sm">
          <caption className="sr-only">
            Taste profiles: conditional mean and SD of each coefficient per respondent
          </caption>
          <thead className="border-b border-line bg-canvas">
            <tr>
              <th className={th} aria-sort={ariaSort('number')}>
                <button type="button" onClick={() => sortBy('number')}>
                  Respondent
                </button>
              </th>
              {data.personalColumns && <th className={th}>External id</th>}
              {latentClass && <th className={th}>Likeliest class</th>}
              {data.coefficients.map((c) => (
                <th
                  key={c.name}
                  className={`${th} text-right`}
                  aria-sort={ariaSort(`mean:${c.name}`)}
                >
                  <button
                    type="button"
                    onClick={() => sortBy(`mean:${c.name}`)}
                    className="text-right"
                  >
                    {c.label}
                    <span className="block font-normal text-ink-muted">
                      {c.distribution === 'fixed' ? 'fixed' : 'mean ± SD'}
                    </span>
                  </button>
                </th>
              ))}
              {data.wtp.map((n) => (
                <th key={n} className={`${th} text-right`} aria-sort={ariaSort(`wtp:${n}`)}>
                  <button type="button" onClick={() => sortBy(`wtp:${n}`)} className="text-right">
                    Conditional-mean WTP: {wtpLabel(n)}
                    {data.costUnit && (
                      <span className="block font-normal text-ink-muted">{data.costUnit}</span>
                    )}
                  </button>
                </th>
              ))}
              <th className={`${th} text-right`} aria-sort={ariaSort('effectiveDraws')}>
                <button type="button" onClick={() => sortBy('effectiveDraws')}>
                  {drawsLabel[data.run.model]}
                </button>
              </th>
              <th className={th}>Quality flags</th>
              {data.questions.map((q) => (
                <th key={q.key} className={th} title={q.text}>
                  {q.key}
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {data.rows.map((r) => (
              <tr key={r.respondentId} className="border-b border-line/60 last:border-0">
                <td className="px-3 py-2 whitespace-nowrap">
                  <Link
                    className="font-medium text-primary hover:underline"
                    to={respondentHref(r.respondentId)}
                  >
                    #{r.number}
                  </Link>
                </td>
                {data.personalColumns && (
                  <td className="px-3 py-2 font-mono text-xs">{r.externalId ?? '—'}</td>
                )}
                {latentClass && (
                  <td className="px-3 py-2 whitespace-nowrap">
                    {r.likeliestClass ?? '—'}
                    <span className="ml-1 text-xs text-ink-muted">
                      ({formatNumber(r.classProbability, 2)})
                    </span>
                  </td>
                )}
                {data.coefficients.map((c) => (
                  <td key={c.name} className={num}>
                    {c.distribution === 'fixed' ? (
                      <span
                        className="text-ink-muted"
                        title="Fixed coefficient: the same for everybody"
                      >
                        {formatNumber(r.mean[c.name])}
                      </span>
                    ) : (
                      <>
                        {formatNumber(r.mean[c.name])}
                        <span className="ml-1 text-xs text-ink-muted">
                          ± {formatNumber(r.sd[c.name])}
                        </span>
                        {r.lower && r.upper && (
                          <span className="block text-xs text-ink-muted">
                            95 % {formatNumber(r.lower[c.name], 2)} to{' '}
                            {formatNumber(r.upper[c.name], 2)}
                          </span>
                        )}
                      </>
                    )}
                  </td>
                ))}
                {data.wtp.map((n) => (
                  <td key={n} className={num}>
                    {formatNumber(r.wtp?.[n], 2)}
                  </td>
                ))}
                <td className={num}>
                  {r.lowDraws && (
                    <span className="mr-2 rounded bg-accent-soft px-1.5 py-0.5 font-sans text-xs text-ink">
                      few draws
                    </span>
                  )}
                  {formatNumber(r.effectiveDraws, 0)}
                </td>
                <td className="px-3 py-2 text-xs">{r.flags.length ? r.flags.join(', ') : '—'}</td>
                {data.questions.map((q) => (
                  <td
                    key={q.key}
                    className="max-w-48 truncate px-3 py-2 text-xs"
                    title={r.answers[q.key] ?? ''}
                  >
                    {r.answers[q.key] ?? '—'}
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {data.rows.length === 0 && (
          <p className="px-4 py-6 text-center text-sm text-ink-muted">
            No respondent matches these filters.
          </p>
        )}
      </div>
      <nav
        aria-label="Pages"
        className="mt-3 flex flex-wrap items-center justify-between gap-2 text-sm"
      >
        <span className="text-ink-soft">
          {data.total} respondents · page {data.page} of {pages}
        </span>
        <div className="flex items-center gap-2">
          <label className="flex items-center gap-2 text-ink-soft">
            Rows
            <select
              className="h-8 rounded-md border border-line bg-white px-2"
              value={query.pageSize}
              onChange={(e) => onChange({ pageSize: Number(e.target.value), page: 1 })}
            >
              {[25, 50, 100].map((n) => (
                <option key={n}>{n}</option>
              ))}
            </select>
          </label>
          <PageButtons page={data.page} pages={pages} onPage={(p) => onChange({ page: p })} />
        </div>
      </nav>
    </div>
  );
}
