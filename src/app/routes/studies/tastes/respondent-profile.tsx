/**
 * One respondent's page: their conditional distribution of every coefficient beside the
 * population's, WTP and background answers, and their choices task by task.
 */
import { useParams } from 'react-router';
import { Card, Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { paths } from '@/config/paths';
import { useRespondentProfile } from '@/features/tastes/api/get-respondent-profile';
import { RespondentDistributionChart } from '@/features/tastes/components/respondent-distribution-chart';
import { RespondentChoices } from '@/features/tastes/components/respondent-choices';
import { TasteCautions } from '@/features/tastes/components/taste-cautions';
import { formatAmount, formatNumber } from '@/utils/format';
import { BackLink } from '@/components/ui/back-link';

export function Component() {
  const { teamId = '', studyId = '', runId = '', respondentId = '' } = useParams();
  const profile = useRespondentProfile(teamId, studyId, runId, respondentId);
  if (profile.isPending) return <Spinner label="Loading the respondent…" />;
  if (profile.error) return <ErrorText error={profile.error} />;
  const { header, row, choices, definition } = profile.data;
  const random = header.coefficients.filter((c) => c.distribution !== 'fixed');
  const fixed = header.coefficients.filter((c) => c.distribution === 'fixed');
  const back = `${paths.studySection.getHref(teamId, studyId, 'tastes')}?run=${runId}`;
  return (
    <div className="space-y-6">
      <div>
        <BackLink to={back}>Tastes</BackLink>
        <h2 className="mt-1 text-xl font-semibold text-ink">Respondent #{row.number}</h2>
        <p className="text-sm text-ink-soft">
          Block {row.block} · {formatNumber(row.effectiveDraws, 0)} effective draws
          {row.lowDraws && ' (few)'} ·{' '}
          {row.flags.length ? `flags: ${row.flags.join(', ')}` : 'no quality flags'}
          {header.personalColumns && row.externalId && ` · external id ${row.externalId}`}
        </p>
      </div>
      <TasteCautions screen="respondent" lowDraws={row.lowDraws ? 1 : 0} />
      <Card title="Conditional distribution beside the population">
        <div className="grid gap-4 sm:grid-cols-2 xl:grid-cols-3">
          {random.map((c) => (
            <RespondentDistributionChart
              key={c.name}
              coefficient={c}
              mean={row.mean[c.name] ?? 0}
              sd={row.sd[c.name] ?? 0}
            />
          ))}
        </div>
        {fixed.length > 0 && (
          <p className="mt-4 text-sm text-ink-soft">
            Fixed coefficients, the same for everybody:{' '}
            {fixed.map((c, i) => (
              <span key={c.name}>
                {i > 0 && ' · '}
                {c.label}{' '}
                <span className="font-mono tabular-nums">{formatNumber(c.populationMean)}</span>
              </span>
            ))}
          </p>
        )}
      </Card>
      <div className="grid gap-6 lg:grid-cols-2">
        {header.wtp.length > 0 && (
          <Card title="Conditional-mean WTP (given this respondent's choices)">
            <dl className="divide-y divide-line text-sm">
              {header.wtp.map((n) => (
                <div key={n} className="flex justify-between gap-4 py-1.5">
                  <dt>{header.coefficients.find((c) => c.name === n)?.label ?? n}</dt>
                  <dd className="font-mono whitespace-nowrap tabular-nums">
                    {formatAmount(row.wtp?.[n], header.costUnit)}
                  </dd>
                </div>
              ))}
            </dl>
          </Card>
        )}
        {header.questions.length > 0 && (
          <Card title="Background answers">
            <dl className="divide-y divide-line text-sm">
              {header.questions.map((q) => (
                <div key={q.key} className="flex justify-between gap-4 py-1.5">
                  <dt className="text-ink-soft">{q.text}</dt>
                  <dd className="text-right">{row.answers[q.key] ?? '—'}</dd>
                </div>
              ))}
            </dl>
          </Card>
        )}
      </div>
      <Card title="Choices, task by task">
        <RespondentChoices definition={definition} choices={choices} />
      </Card>
    </div>
  );
}
