/**
 * Models section: start an estimation run, follow it while it runs, and compare finished runs.
 * Everyone in the team sees the runs; owners and analysts may start and cancel them.
 */
import { useState } from 'react';
import { useNavigate, useParams } from 'react-router';
import { Card, EmptyState, Spinner } from '@/components/ui/feedback';
import { ErrorText, PanelErrorBoundary } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import { useRuns } from '@/features/runs/api/list-runs';
import { useRunOptions } from '@/features/runs/api/get-run-options';
import { RunForm } from '@/features/runs/components/run-form';
import { RunsList } from '@/features/runs/components/runs-list';
import { RunComparison } from '@/features/runs/components/run-comparison';
import { RunCautions } from '@/features/runs/components/run-cautions';
import { paths } from '@/config/paths';
import { useStudy } from '@/features/studies/api/get-study';
import { SaveFilterForm, type FilterQuestion } from '@/features/runs/components/save-filter-form';
import { questionnaireSchema } from '@shared/schemas/questionnaire';
import { SectionHeader } from '@/components/ui/section-header';

/** Background questions with answer options, for saved respondent filters. */
function getFilterQuestions(questionnaire: unknown): FilterQuestion[] {
  const parsed = questionnaireSchema.safeParse(questionnaire);
  if (!parsed.success) return [];
  return parsed.data.pages.flatMap((p) =>
    (p.kind === 'question' || p.kind === 'screening') &&
    (p.question.type === 'single' || p.question.type === 'multiple')
      ? [{ key: p.question.key, text: p.question.text, options: p.question.options }]
      : [],
  );
}

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { can } = useCurrentTeam();
  const canManage = can('runs:manage');
  const navigate = useNavigate();
  const runs = useRuns(teamId, studyId);
  const options = useRunOptions(teamId, studyId);
  const study = useStudy(teamId, studyId);
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [formOpen, setFormOpen] = useState(false);

  const toggle = (id: string) =>
    setSelected((old) => {
      const next = new Set(old);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  const compared = (runs.data ?? []).filter((r) => selected.has(r.id) && r.status === 'done');
  const noData = options.data !== undefined && options.data.includedRespondents === 0;

  return (
    <div className="space-y-6">
      <SectionHeader
        title="Models"
        description={
          <>
            Estimation runs on the included respondents: multinomial logit first, then panel mixed
            logit, hierarchical Bayes or latent class logit with each respondent&apos;s taste
            profile.
          </>
        }
      >
        {canManage && !formOpen && options.data && (
          <Button onClick={() => setFormOpen(true)} disabled={noData}>
            New run
          </Button>
        )}
      </SectionHeader>

      {canManage && formOpen && (
        <Card
          title="New run"
          actions={
            <Button variant="ghost" size="sm" onClick={() => setFormOpen(false)}>
              Close
            </Button>
          }
        >
          <PanelErrorBoundary>
            {options.isPending ? (
              <Spinner />
            ) : options.error ? (
              <ErrorText error={options.error} />
            ) : (
              <RunForm
                teamId={teamId}
                studyId={studyId}
                options={options.data}
                onStarted={() => setFormOpen(false)}
              />
            )}
          </PanelErrorBoundary>
          <details className="mt-6 border-t border-line pt-4">
            <summary className="cursor-pointer text-sm font-medium text-primary">
              Save a respondent filter
            </summary>
            <div className="mt-4">
              <SaveFilterForm
                teamId={teamId}
                studyId={studyId}
                questions={getFilterQuestions(study.data?.questionnaire)}
              />
            </div>
          </details>
        </Card>
      )}

      <section aria-labelledby="runs-heading" className="space-y-3">
        <h3 id="runs-heading" className="text-base font-semibold text-ink">
          Runs
        </h3>
        {runs.isPending ? (
          <Spinner label="Loading runs…" />
        ) : runs.error ? (
          <ErrorText error={runs.error} />
        ) : runs.data.length === 0 ? (
          <EmptyState title="No runs yet">
            {noData
              ? 'Runs need completed, included respondents. They appear once fieldwork has answers.'
              : canManage
                ? 'Start with a multinomial logit; then try a mixed logit with random tastes.'
                : 'An owner or analyst of the team starts estimation runs.'}
          </EmptyState>
        ) : (
          <RunsList
            teamId={teamId}
            studyId={studyId}
            runs={runs.data}
            canManage={canManage}
            selected={selected}
            onToggle={toggle}
          />
        )}
      </section>

      {compared.length > 0 && (
        <section aria-labelledby="compare-heading" className="space-y-3">
          <div className="flex flex-wrap items-center justify-between gap-2">
            <h3 id="compare-heading" className="text-base font-semibold text-ink">
              Comparison of {compared.length} run{compared.length > 1 ? 's' : ''}
            </h3>
            {compared.length === 1 && (
              <Button
                variant="ghost"
                size="sm"
                onClick={() =>
                  navigate(paths.runEstimates.getHref(teamId, studyId, compared[0].id))
                }
              >
                Open estimates
              </Button>
            )}
          </div>
          <RunComparison runs={compared} />
        </section>
      )}
      {(runs.data ?? []).some((r) => r.status === 'done') && <RunCautions screen="models" />}
    </div>
  );
}
