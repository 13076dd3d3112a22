/**
 * Tastes section: each respondent's taste profile from a finished mixed-logit run (table with
 * server-side sorting, filters and pages), segments of one coefficient, and the cautions.
 * Every role may read it; external ids and free-text answers only with 'personal:read'.
 */
import { useState } from 'react';
import { useParams, useSearchParams } from 'react-router';
import { Alert, Spinner } from '@/components/ui/feedback';
import { erasureNotice } from '@shared/schemas/exports';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { paths } from '@/config/paths';
import { useTastesRuns } from '@/features/tastes/api/list-tastes-runs';
import { useTastes, type TastesQuery } from '@/features/tastes/api/list-tastes';
import { RunPicker } from '@/features/tastes/components/run-picker';
import { TastesTable } from '@/features/tastes/components/tastes-table';
import { TastesFilters } from '@/features/tastes/components/tastes-filters';
import { SegmentsPanel } from '@/features/tastes/components/segments-panel';
import { TasteCautions } from '@/features/tastes/components/taste-cautions';
import { ComparisonPanel } from '@/features/tastes/components/comparison-panel';
import { EmptyUntilSection } from './empty-until-section';
import { SectionHeader } from '@/components/ui/section-header';

const initialQuery = { page: 1, pageSize: 25, sort: 'number', dir: 'asc' as const };

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const runs = useTastesRuns(teamId, studyId);
  const withProfiles = (runs.data ?? []).filter((r) => r.profiles > 0);
  const runId = search.get('run') ?? withProfiles[0]?.id ?? '';
  const [query, setQuery] = useState<Omit<TastesQuery, 'runId'>>(initialQuery);
  const tastes = useTastes(teamId, studyId, { ...query, runId });

  if (runs.isPending) return <Spinner label="Loading runs…" />;
  if (runs.error) return <ErrorText error={runs.error} />;
  if (withProfiles.length === 0)
    return (
      <EmptyUntilSection
        teamId={teamId}
        studyId={studyId}
        title="No taste profiles yet"
        section="models"
        label="Models"
      >
        Taste profiles come from a finished mixed logit, hierarchical Bayes or latent class run:
        each respondent&apos;s individual means and SDs given the choices they made.
      </EmptyUntilSection>
    );

  const header = tastes.data;
  const lowDrawsShown = header?.rows.filter((r) => r.lowDraws).length;
  return (
    <div className="space-y-6">
      <SectionHeader
        title="Tastes"
        description={
          <>
            Each respondent&apos;s conditional mean and SD of every coefficient, given their
            choices.
          </>
        }
      >
        <RunPicker
          runs={runs.data}
          value={runId}
          onChange={(id) => {
            setSearch({ run: id }, { replace: true });
            setQuery(initialQuery);
          }}
        />
      </SectionHeader>
      <TasteCautions screen="tastes" lowDraws={lowDrawsShown} />
      {header && header.run.erasedRespondents > 0 && (
        <Alert tone="warning" title="Respondents erased since this run">
          {erasureNotice(header.run.erasedRespondents)}
        </Alert>
      )}
      <ErrorText error={tastes.error} />
      {!header && tastes.isPending && <Spinner label="Loading profiles…" />}
      {header && (
        <>
          <PanelErrorBoundary title="The segments could not be shown">
            <SegmentsPanel key={header.run.id} teamId={teamId} studyId={studyId} header={header} />
          </PanelErrorBoundary>
          <PanelErrorBoundary title="The comparison could not be shown">
            <ComparisonPanel teamId={teamId} studyId={studyId} runs={runs.data} runId={runId} />
          </PanelErrorBoundary>
          <section aria-labelledby="profiles-heading" className="space-y-3">
            <h3 id="profiles-heading" className="text-base font-semibold text-ink">
              Taste profiles
            </h3>
            {!header.personalColumns && (
              <p className="text-xs text-ink-muted">
                Your role does not read personal data: external ids and free-text answers are left
                out.
              </p>
            )}
            <TastesFilters
              header={header}
              query={{ ...query, runId }}
              onChange={(patch) => setQuery((q) => ({ ...q, ...patch }))}
            />
            <TastesTable
              data={header}
              query={{ ...query, runId }}
              onChange={(patch) => setQuery((q) => ({ ...q, ...patch }))}
              respondentHref={(respondentId) =>
                paths.respondentProfile.getHref(teamId, studyId, runId, respondentId)
              }
            />
          </section>
        </>
      )}
    </div>
  );
}
