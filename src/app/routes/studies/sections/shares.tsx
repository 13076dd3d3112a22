/**
 * Shares section (what-if share simulator): hypothetical alternatives defined by their levels,
 * simulated in the browser over every respondent's own estimates from a finished run (the run's
 * share model is loaded once; shared/engine/shares computes each edit), with 95 % intervals,
 * overall and by segment (a background answer, the alternative chosen in a task, or the
 * likeliest latent class). Welfare is computed on the server on request. Every role may
 * simulate.
 */
import { useRef, useState } from 'react';
import type { Chart } from 'chart.js';
import { useParams, useSearchParams } from 'react-router';
import { Alert, Card, EmptyState, Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { CheckboxField } from '@/components/ui/checkbox-field';
import { useStudy } from '@/features/studies/api/get-study';
import { useTastesRuns } from '@/features/tastes/api/list-tastes-runs';
import { useTastes } from '@/features/tastes/api/list-tastes';
import { RunPicker } from '@/features/tastes/components/run-picker';
import { useSimulateShares } from '@/features/shares/api/simulate-shares';
import { useShareModel } from '@/features/shares/api/get-share-model';
import { useShareGroups } from '@/features/shares/api/get-share-groups';
import { makeAlternative, ScenarioEditor } from '@/features/shares/components/scenario-editor';
import { ShareResults } from '@/features/shares/components/share-results';
import { SegmentPicker, toGroupsParams } from '@/features/shares/components/segment-picker';
import { WelfarePanel } from '@/features/shares/components/welfare-panel';
import { ScenarioLibrary } from '@/features/shares/components/scenario-library';
import { DemandCurveCard } from '@/features/shares/components/demand-curve-card';
import { ShareDownloads } from '@/features/shares/components/share-downloads';
import { useCurrentTeam } from '@/features/auth/hooks/use-current-team';
import {
  usePreparedShareModel,
  useScenarioShares,
} from '@/features/shares/hooks/use-scenario-shares';
import { describeInterval } from '@/features/shares/utils/interval-text';
import type { ScenarioAlternative } from '@shared/schemas/shares';
import { SectionHeader } from '@/components/ui/section-header';

/** How the shares are computed, per model family of the run. */
const METHOD_TEXT: Record<string, string> = {
  mixed:
    'Each respondent gets logit choice probabilities from their own taste profile (conditional on their choices); the share is the average over respondents, not the choice of one average person.',
  hb: 'Each respondent gets logit choice probabilities from their own posterior (hierarchical Bayes); the share is the average over respondents. The posterior draws are not kept, so each respondent’s posterior is approximated by its mean and SD.',
  latent_class:
    'Each respondent’s probabilities are the class logit probabilities weighted by their own posterior class probabilities; the share is the average over respondents.',
  mnl: 'This is a multinomial logit run: everybody shares one set of coefficients, so shares follow the logit formula without taste variation. Choose a run with individual estimates (mixed logit, HB or latent class) for shares over respondents.',
};

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const [search, setSearch] = useSearchParams();
  const study = useStudy(teamId, studyId);
  const runs = useTastesRuns(teamId, studyId);
  const runId = search.get('run') ?? runs.data?.[0]?.id ?? '';
  const run = runs.data?.find((r) => r.id === runId);
  const header = useTastes(teamId, studyId, {
    runId: run && run.profiles > 0 ? runId : '',
    page: 1,
    pageSize: 1,
    sort: 'number',
    dir: 'asc',
  }).data;
  const model = useShareModel(teamId, studyId, run ? runId : '');
  const prepared = usePreparedShareModel(model.data);
  const [alternatives, setAlternatives] = useState<ScenarioAlternative[] | null>(null);
  const [includeFixed, setIncludeFixed] = useState(true);
  const [segment, setSegment] = useState('');
  const [loaded, setLoaded] = useState<{ id: string; name: string } | null>(null);
  const { can } = useCurrentTeam();
  const sharesChart = useRef<Chart | null>(null);
  const groups = useShareGroups(teamId, studyId, toGroupsParams(runId, segment));
  const simulate = useSimulateShares(teamId, studyId);
  const definition = model.data?.definition ?? study.data?.definition;
  const scenario =
    alternatives ?? (definition ? [0, 1].map((i) => makeAlternative(definition, i)) : []);
  const outcome = useScenarioShares(prepared, scenario, includeFixed, groups.data ?? null);

  if (study.isPending || runs.isPending) return <Spinner label="Loading…" />;
  if (study.error || runs.error) return <ErrorText error={study.error ?? runs.error} />;
  if (runs.data.length === 0 || !definition)
    return (
      <EmptyState title="No finished run yet">
        Shares are simulated over the respondents&apos; taste profiles of a finished run. Start one
        in Models.
      </EmptyState>
    );
  const fixed = definition.fixedAlternative;
  const request = {
    runId,
    alternatives: scenario,
    includeFixed,
  };
  const segmentParams = toGroupsParams(runId, segment);
  const exportRequest = {
    ...request,
    name: loaded?.name ?? '',
    segmentBy: segmentParams ? { ...segmentParams, runId: undefined } : null,
  };
  // Welfare stays on screen while the inputs change, marked out of date from the first edit.
  const stale =
    simulate.data !== undefined && JSON.stringify(simulate.variables) !== JSON.stringify(request);

  return (
    <div className="space-y-6">
      <SectionHeader
        title="Shares"
        description={<>What would respondents choose between options that do not exist yet?</>}
      >
        <RunPicker
          runs={runs.data}
          value={runId}
          withProfiles={false}
          onChange={(id) => {
            setSearch({ run: id }, { replace: true });
            setSegment('');
            simulate.reset();
          }}
        />
      </SectionHeader>
      <Alert tone="info" title="How the shares are computed">
        {METHOD_TEXT[run?.model ?? 'mnl']} Shares of stated, hypothetical choices usually overstate
        real uptake; treat them as comparisons between scenarios, not forecasts.
      </Alert>
      <Card title="Scenario">
        <ScenarioEditor
          definition={definition}
          alternatives={scenario}
          onChange={setAlternatives}
        />
        <div className="mt-4 flex flex-wrap items-end gap-4">
          {fixed && (
            <CheckboxField
              label={`Include “${fixed.label}”`}
              checked={includeFixed}
              onChange={setIncludeFixed}
            />
          )}
          <SegmentPicker header={header} model={run?.model} value={segment} onChange={setSegment} />
        </div>
      </Card>
      <ErrorText error={model.error ?? groups.error} />
      {model.isPending && run && <Spinner label="Loading the run’s taste profiles…" />}
      {outcome.error && (
        <Alert tone="warning" title="The scenario is not complete">
          {outcome.error.message}
        </Alert>
      )}
      {outcome.shares && model.data && (
        <Card title="Predicted shares">
          <ShareResults
            result={outcome.shares}
            respondents={model.data.sampleRespondents}
            segments={groups.data ?? null}
            chartRef={sharesChart}
          />
          <p className="mt-3 text-xs text-ink-muted">
            {describeInterval(
              outcome.shares.interval,
              prepared?.draws?.draws ?? 0,
              model.data.intervalNote,
            )}
          </p>
          <div className="mt-3">
            <ShareDownloads
              what="shares"
              request={exportRequest}
              chart={sharesChart}
              pngName="predicted-shares.png"
            />
          </div>
        </Card>
      )}
      {outcome.shares && prepared && (
        <Card title="Demand curve">
          <DemandCurveCard
            prepared={prepared}
            alternatives={scenario}
            includeFixed={includeFixed}
            request={exportRequest}
          />
        </Card>
      )}
      <Card title={loaded ? `Saved scenarios — editing “${loaded.name}”` : 'Saved scenarios'}>
        <ScenarioLibrary
          teamId={teamId}
          studyId={studyId}
          canWrite={can('scenarios:write')}
          prepared={prepared}
          current={{ alternatives: scenario, includeFixed }}
          loaded={loaded}
          onLoad={(s) => {
            setLoaded(s ? { id: s.id, name: s.name } : null);
            if (s) {
              setAlternatives(s.alternatives);
              setIncludeFixed(s.includeFixed);
            }
          }}
        />
      </Card>
      <Card title="Welfare against the status quo">
        <div className="space-y-3">
          <Button
            variant="secondary"
            onClick={() => simulate.mutate(request)}
            busy={simulate.isPending}
          >
            {simulate.data ? 'Compute welfare again' : 'Compute welfare'}
          </Button>
          <ErrorText error={simulate.error} />
          {simulate.data && stale && (
            <Alert tone="warning">
              The scenario changed after this was computed. Compute it again to update it.
            </Alert>
          )}
          {simulate.data && (
            <div className={stale ? 'opacity-50' : undefined}>
              <WelfarePanel result={simulate.data} />
            </div>
          )}
        </div>
      </Card>
    </div>
  );
}
