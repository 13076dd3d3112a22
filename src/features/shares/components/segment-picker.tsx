/**
 * Which segments to split the shares by: a single-choice background question, the alternative
 * chosen in one design task, or (latent class runs) the likeliest class. The value is encoded
 * as '' (none), 'q:<question key>', 't:<task>' or 'class'.
 */
import { SelectField } from '@/components/ui/field';
import type { TasteHeader } from '@shared/schemas/tastes';
import type { ShareGroupsParams } from '../api/share-keys';
import { Options } from '@/components/ui/options';

export function toGroupsParams(runId: string, value: string): ShareGroupsParams | null {
  if (!runId || !value) return null;
  if (value === 'class') return { runId, groupBy: 'class' };
  if (value.startsWith('t:')) return { runId, groupBy: 'task', task: Number(value.slice(2)) };
  if (value.startsWith('q:')) return { runId, groupBy: 'question', question: value.slice(2) };
  return null;
}

export function SegmentPicker({
  header,
  model,
  value,
  onChange,
}: {
  header: Pick<TasteHeader, 'questions' | 'tasks'> | undefined;
  model: string | undefined;
  value: string;
  onChange: (value: string) => void;
}) {
  const questions = (header?.questions ?? []).filter((q) => q.type === 'single');
  const tasks = header?.tasks ?? [];
  const individual = model !== undefined && model !== 'mnl';
  return (
    <SelectField
      label="Shares by segment"
      value={value}
      onChange={(e) => onChange(e.target.value)}
      wrapperClassName="w-full sm:w-72"
      disabled={!individual}
      hint={individual ? undefined : 'Segments need a run with individual estimates.'}
    >
      <option value="">No segments</option>
      {model === 'latent_class' && <option value="class">Likeliest latent class</option>}
      {questions.length > 0 && (
        <optgroup label="Background answers">
          <Options items={questions.map((q) => ({ value: `q:${q.key}`, label: q.text }))} />
        </optgroup>
      )}
      {tasks.length > 0 && (
        <optgroup label="Alternative chosen in a task">
          {tasks.map((t) => (
            <option key={t.task} value={`t:${t.task}`}>
              Choice in task {t.task} (block {t.block})
            </option>
          ))}
        </optgroup>
      )}
    </SelectField>
  );
}
