/**
 * Shares section (what-if share simulator): hypothetical alternatives defined by their levels,
 * simulated over every respondent's own estimates from a finished run (conditional means, HB
 * posterior means, or latent class probabilities), overall and by segment (a background answer,
 * or the likeliest latent class). Every role may simulate; nothing is stored.
 */
import { useState } from 'react';
import { useParams, useSearchParams } from 'react-router';
import { Alert, Card, EmptyState, Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { Button } from '@/components/ui/button';
import { SelectField } from '@/components/ui/field';
import { useStudy } from '@/features/studies/api/get-study';
import { useTastesRuns } from '@/features/tastes/api/list-tastes-runs';
import { useTastes } from '@/features/tastes/api/list-tastes';
import { RunPicker } from '@/features/tastes/components/run-picker';
import { useSimulateShares } from '@/features/shares/api/simulate-shares';
import { makeAlternative, ScenarioEditor } from '@/features/shares/components/scenario-editor';
import { ShareResults } from '@/features/shares/components/share-results';
import { WelfarePanel } from '@/features/shares/components/welfare-panel';
import type { ScenarioAlternative } from '@shared/schemas/shares';

/** The segment choice that splits by the likeliest latent class (no question key has a colon). */
const CLASS_SEGMENT = ':class';

/** How the shares are computed, per model family of the run. */
const METHOD_TEXT: Record<string, string> = {
  mixed:
    'Each respondent gets logit choice probabilities from their own conditional means (their taste profile); the share is the average over respondents, not the choice of one average person. Uncertainty within each profile is not carried into the shares.',
  hb: 'Each respondent gets logit choice probabilities from their own posterior means (hierarchical Bayes); the share is the average over respondents. The posterior draws are not kept, so uncertainty within each respondent is not carried into the shares, which makes individual probabilities somewhat more extreme.',
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
  const [alternatives, setAlternatives] = useState<ScenarioAlternative[] | null>(null);
  const [includeFixed, setIncludeFixed] = useState(true);
  const [segment, setSegment] = useState('');
  const simulate = useSimulateShares(teamId, studyId);

  if (study.isPending || runs.isPending) return <Spinner label="Loading…" />;
  if (study.error || runs.error) return <ErrorText error={study.error ?? runs.error} />;
  const definition = study.data.definition;
  if (runs.data.length === 0)
    return (
      <EmptyState title="No finished run yet">
        Shares are simulated over the respondents&apos; taste profiles of a finished run. Start one
        in Models.
      </EmptyState>
    );
  const scenario = alternatives ?? [0, 1].map((i) => makeAlternative(definition, i));
  const segmentOptions = (header?.questions ?? []).filter((q) => q.type === 'single');
  const fixed = definition.fixedAlternative;
  const request = {
    runId,
    alternatives: scenario,
    includeFixed,
    segmentBy:
      segment === CLASS_SEGMENT
        ? { groupBy: 'class' as const }
        : segment
          ? { groupBy: 'question' as const, question: segment }
          : null,
  };
  const onSimulate = () => simulate.mutate(request);
  // Results stay on screen while the inputs change, marked out of date from the first edit.
  const stale =
    simulate.data !== undefined && JSON.stringify(simulate.variables) !== JSON.stringify(request);

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h2 className="text-xl font-semibold text-ink">Shares</h2>
          <p className="text-sm text-ink-soft">
            What would respondents choose between options that do not exist yet?
          </p>
        </div>
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
      </div>
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
            <label className="flex items-center gap-2 text-sm">
              <input
                type="checkbox"
                checked={includeFixed}
                onChange={(e) => setIncludeFixed(e.target.checked)}
                className="size-4 accent-primary"
              />
              Include “{fixed.label}”
            </label>
          )}
          <SelectField
            label="Shares by segment"
            value={segment}
            onChange={(e) => setSegment(e.target.value)}
            wrapperClassName="w-full sm:w-72"
            disabled={segmentOptions.length === 0 && run?.model !== 'latent_class'}
          >
            <option value="">No segments</option>
            {run?.model === 'latent_class' && (
              <option value={CLASS_SEGMENT}>Likeliest latent class</option>
            )}
            {segmentOptions.map((q) => (
              <option key={q.key} value={q.key}>
                {q.text}
              </option>
            ))}
          </SelectField>
          <Button onClick={onSimulate} busy={simulate.isPending}>
            Simulate shares
          </Button>
        </div>
      </Card>
      <ErrorText error={simulate.error} />
      {simulate.data && (
        <Card title={stale ? 'Predicted shares — out of date' : 'Predicted shares'}>
          {stale && (
            <Alert tone="warning" className="mb-4">
              The scenario changed after these shares were simulated. Simulate again to update them.
            </Alert>
          )}
          <div className={stale ? 'opacity-50' : undefined}>
            <ShareResults result={simulate.data} />
          </div>
        </Card>
      )}
      {simulate.data && (
        <Card title="Welfare against the status quo">
          <div className={stale ? 'opacity-50' : undefined}>
            <WelfarePanel result={simulate.data} />
          </div>
        </Card>
      )}
    </div>
  );
}
