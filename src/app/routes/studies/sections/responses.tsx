/**
 * Responses section: respondents with automatic quality flags and the include/exclude
 * decisions that estimation uses. Every role reads it; personal columns come only to roles
 * allowed to see them, and only analysts, editors and owners change inclusion.
 */
import { useState } from 'react';
import { useParams } from 'react-router';
import type { ListResponsesQuery, QualityFlagKey } from '@shared/schemas/responses';
import { Alert, EmptyState, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { Pagination } from '@/components/ui/pagination';
import { SelectField } from '@/components/ui/field';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useResponses } from '@/features/responses/api/list-responses';
import { QualitySummary } from '@/features/responses/components/quality-summary';
import { ResponsesTable } from '@/features/responses/components/responses-table';
import { ResponseCards } from '@/features/responses/components/response-cards';
import { QualitySettingsForm } from '@/features/responses/components/quality-settings-form';
import { ExcludeFlaggedForm } from '@/features/responses/components/exclude-flagged-form';
import { EraseRespondentForm } from '@/features/responses/components/erase-respondent-form';
import { statusLabels } from '@/features/responses/utils/labels';
import { languageName } from '@shared/languages/language-tags';
import { Options } from '@/components/ui/options';

const PAGE_SIZE = 50;
type Filters = Pick<ListResponsesQuery, 'status' | 'included' | 'flag' | 'language'> & {
  sort: ListResponsesQuery['sort'];
  order: ListResponsesQuery['order'];
};

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const canManage = can('responses:manage');
  const canErase = can('respondents:erase');
  const [filters, setFilters] = useState<Filters>({ sort: 'started', order: 'desc' });
  const [page, setPage] = useState(1);
  const list = useResponses(teamId, studyId, { ...filters, page, pageSize: PAGE_SIZE });
  const set = (patch: Partial<Filters>) => {
    setFilters((f) => ({ ...f, ...patch }));
    setPage(1);
  };

  if (list.isPending) return <Spinner label="Loading responses…" />;
  if (list.error) return <ErrorText error={list.error} />;
  const data = list.data;
  const pages = Math.max(1, Math.ceil(data.total / PAGE_SIZE));
  const listView = { teamId, studyId, list: data, canManage };

  return (
    <div className="space-y-6">
      <div>
        <h2 className="text-xl font-semibold text-ink">Responses</h2>
        <p className="text-sm text-ink-soft">
          Quality flags are computed from the stored answers. They point at respondents to look at;
          whether to exclude them is your decision, recorded with a reason.
        </p>
      </div>

      {data.summary.respondents === 0 ? (
        <EmptyState title="No respondents yet">
          Respondents appear here as soon as they open the survey link.
        </EmptyState>
      ) : (
        <>
          <PanelErrorBoundary>
            <QualitySummary
              summary={data.summary}
              active={filters.flag}
              onPick={(flag: QualityFlagKey | 'any' | undefined) => set({ flag })}
            />
          </PanelErrorBoundary>

          <Alert tone="info">
            Published guidance is to flag and compare results with and without the flagged
            respondents rather than delete them automatically. Exclusions only affect new estimation
            runs.
          </Alert>
          {canManage && (
            <details className="group rounded-lg border border-line bg-white">
              <summary className="flex cursor-pointer flex-wrap items-center justify-between gap-2 px-4 py-3 text-sm font-medium text-ink">
                <span className="flex items-center gap-2">
                  <span aria-hidden className="transition-transform group-open:rotate-90">
                    ▸
                  </span>
                  Quality rules and bulk exclusion
                </span>
                <span className="text-xs font-normal text-ink-muted">
                  speeders under {data.settings.speederFraction} × the median time
                </span>
              </summary>
              <div className="grid gap-6 border-t border-line p-4 lg:grid-cols-2">
                <section aria-label="Speeders">
                  <QualitySettingsForm teamId={teamId} studyId={studyId} settings={data.settings} />
                </section>
                <section aria-label="Exclude flagged respondents">
                  <ExcludeFlaggedForm teamId={teamId} studyId={studyId} summary={data.summary} />
                </section>
              </div>
            </details>
          )}
          <div className="grid grid-cols-2 gap-2 sm:grid-cols-4 lg:grid-cols-5">
            <SelectField
              label="Status"
              value={filters.status ?? ''}
              onChange={(e) => set({ status: (e.target.value || undefined) as Filters['status'] })}
            >
              <option value="">All</option>
              {Object.entries(statusLabels).map(([v, l]) => (
                <option key={v} value={v}>
                  {l}
                </option>
              ))}
            </SelectField>
            <SelectField
              label="Estimation"
              value={filters.included ?? ''}
              onChange={(e) =>
                set({ included: (e.target.value || undefined) as Filters['included'] })
              }
            >
              <option value="">All</option>
              <option value="true">Included</option>
              <option value="false">Excluded</option>
            </SelectField>
            {data.languages.length > 1 && (
              <SelectField
                label="Language"
                value={filters.language ?? ''}
                onChange={(e) => set({ language: e.target.value || undefined })}
              >
                <option value="">All</option>
                <Options
                  items={data.languages.map((l) => ({ value: l, label: languageName(l) }))}
                />
              </SelectField>
            )}
            <SelectField
              label="Sort by"
              wrapperClassName="col-span-2 sm:col-span-1"
              value={`${filters.sort}:${filters.order}`}
              onChange={(e) => {
                const [sort, order] = e.target.value.split(':') as [
                  Filters['sort'],
                  Filters['order'],
                ];
                set({ sort, order });
              }}
            >
              <option value="started:desc">Newest first</option>
              <option value="started:asc">Oldest first</option>
              <option value="duration:asc">Fastest first</option>
              <option value="duration:desc">Slowest first</option>
            </SelectField>
          </div>

          {data.total === 0 ? (
            <p className="text-sm text-ink-muted">No respondent matches these filters.</p>
          ) : (
            <>
              {/* The same respondents as cards on a phone and as a table from sm up. */}
              <div className="sm:hidden">
                <ResponseCards {...listView} />
              </div>
              <div className="hidden sm:block">
                <ResponsesTable {...listView} />
              </div>
            </>
          )}
          {pages > 1 && (
            <Pagination label="Respondent pages" page={page} pages={pages} onPage={setPage}>
              <span className="num text-ink-soft">
                {page} / {pages} · {data.total} respondents
              </span>
            </Pagination>
          )}
        </>
      )}

      {canErase && (
        <details className="group rounded-lg border border-line bg-white">
          <summary className="flex cursor-pointer items-center gap-2 px-4 py-3 text-sm font-medium text-ink">
            <span aria-hidden className="transition-transform group-open:rotate-90">
              ▸
            </span>
            Erase one respondent (data-protection request)
          </summary>
          <div className="space-y-4 border-t border-line p-4">
            <p className="text-sm text-ink-soft">
              For a person who asks for their data to be erased. Their answers, invitation and taste
              profiles are deleted; everyone else keeps their respondent number, and the audit trail
              records the erasure by number and reason. Your data-protection officer or ethics board
              decides whether a request must be met; backups taken earlier keep the data until they
              expire.
            </p>
            <EraseRespondentForm teamId={teamId} studyId={studyId} />
          </div>
        </details>
      )}
    </div>
  );
}
