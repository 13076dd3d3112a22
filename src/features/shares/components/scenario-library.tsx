/**
 * Saved scenarios of the study: save the one in the editor (new, or over the loaded one), load
 * one, and compare several side by side under the run on screen. Everyone may list, load and
 * compare; owners, editors and analysts save and delete.
 */
import { useState } from 'react';
import { Spinner } from '@/components/ui/feedback';
import { ErrorText } from '@/components/ui/error-boundary';
import type { PreparedShareModel } from '@shared/engine/shares/share-model';
import type { SavedScenario, ScenarioAlternative } from '@shared/schemas/shares';
import { useScenarios } from '../api/list-scenarios';
import { useSaveScenario } from '../api/save-scenario';
import { useDeleteScenario } from '../api/delete-scenario';
import { SaveScenarioForm } from './save-scenario-form';
import { SavedScenarios } from './saved-scenarios';
import { ScenarioComparison } from './scenario-comparison';

export function ScenarioLibrary({
  teamId,
  studyId,
  canWrite,
  prepared,
  current,
  loaded,
  onLoad,
}: {
  teamId: string;
  studyId: string;
  canWrite: boolean;
  prepared: PreparedShareModel | null;
  current: { alternatives: ScenarioAlternative[]; includeFixed: boolean };
  loaded: { id: string; name: string } | null;
  onLoad: (s: SavedScenario | null) => void;
}) {
  const scenarios = useScenarios(teamId, studyId);
  const save = useSaveScenario(teamId, studyId);
  const remove = useDeleteScenario(teamId, studyId);
  const [compared, setCompared] = useState<string[]>([]);
  if (scenarios.isPending) return <Spinner label="Loading saved scenarios…" />;
  if (scenarios.error) return <ErrorText error={scenarios.error} />;
  const list = scenarios.data;
  const chosen = compared
    .map((id) => list.find((s) => s.id === id))
    .filter((s): s is SavedScenario => s !== undefined);
  return (
    <div className="space-y-4">
      {canWrite && (
        <SaveScenarioForm
          loaded={loaded}
          busy={save.isPending}
          onSave={async (name, id) => onLoad(await save.mutateAsync({ id, name, ...current }))}
        />
      )}
      <ErrorText error={remove.error} />
      <SavedScenarios
        scenarios={list}
        loadedId={loaded?.id ?? null}
        compared={compared}
        canWrite={canWrite}
        onLoad={onLoad}
        onToggleCompare={(id) =>
          setCompared((c) => (c.includes(id) ? c.filter((x) => x !== id) : [...c, id]))
        }
        onDelete={(s) =>
          remove.mutate(s.id, {
            onSuccess: () => {
              setCompared((c) => c.filter((x) => x !== s.id));
              if (loaded?.id === s.id) onLoad(null);
            },
          })
        }
      />
      {chosen.length > 0 && prepared && (
        <div>
          <h4 className="mb-2 text-sm font-semibold text-ink">
            {chosen.length === 1 ? 'Tick a second scenario to compare' : 'Compared under this run'}
          </h4>
          <ScenarioComparison prepared={prepared} scenarios={chosen} />
        </div>
      )}
    </div>
  );
}
