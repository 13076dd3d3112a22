/** One density chart per random coefficient, with the shrinkage caution beside them. */
import type { RunResult } from '@shared/schemas/run';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import { useConditionalMeans } from '../api/get-conditional-means';
import { DensityChart } from './density-chart';

export function RandomTastes({
  teamId,
  studyId,
  runId,
  results,
}: {
  teamId: string;
  studyId: string;
  runId: string;
  results: RunResult;
}) {
  const random = results.population.filter((m) => m.distribution !== 'fixed');
  const means = useConditionalMeans(teamId, studyId, runId, random.length > 0);
  if (means.isPending) return <Spinner label="Loading respondents' taste profiles…" />;
  if (means.error) return <ErrorText error={means.error} />;
  const label = new Map(results.columns.map((c) => [c.coefficient, c.label]));
  return (
    <div className="space-y-4">
      <p className="text-sm text-ink-soft">
        Each respondent&apos;s conditional mean is shrunk toward the population and uncertain with
        few tasks, so the histogram is narrower than the population density. The Tastes section
        shows every profile with its conditional SD.
      </p>
      <div className="grid gap-6 lg:grid-cols-2">
        {random.map((m) => {
          const k = means.data.coefficients.indexOf(m.name);
          return (
            <div key={m.name} className="min-w-0">
              <h4 className="mb-1 text-sm font-medium text-ink">{label.get(m.name) ?? m.name}</h4>
              <DensityChart
                moment={m}
                label={label.get(m.name) ?? m.name}
                means={k >= 0 ? means.data.values[k] : []}
              />
            </div>
          );
        })}
      </div>
    </div>
  );
}
