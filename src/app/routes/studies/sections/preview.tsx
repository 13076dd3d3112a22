import { useState } from 'react';
import { Link, useParams } from 'react-router';
import { paths } from '@/config/paths';
import { EmptyState, Spinner } from '@/components/ui/feedback';
import { SelectField } from '@/components/ui/field';
import { ErrorText } from '@/components/ui/error-boundary';
import {
  ChoiceTaskCard,
  type ChoiceTaskAlternative,
} from '@/components/choice-task/choice-task-card';
import { useStudy } from '@/features/studies/api/get-study';
import { useDesignState } from '@/features/design/api/get-design-state';

/** Any task as a respondent will see it, on a phone-sized frame and at desktop width. */
export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const { data: study } = useStudy(teamId, studyId);
  const state = useDesignState(teamId, studyId);
  const [block, setBlock] = useState(1);
  const [taskIndex, setTaskIndex] = useState(0);
  const [chosen, setChosen] = useState<number | null>(null);
  if (!study || state.isPending) return <Spinner />;
  if (state.error) return <ErrorText error={state.error} />;
  const design = state.data.design?.design;
  if (!design)
    return (
      <EmptyState
        title="Nothing to preview yet"
        action={
          <Link
            className="font-medium text-primary underline"
            to={paths.studySection.getHref(teamId, studyId, 'tasks')}
          >
            Create the choice tasks
          </Link>
        }
      >
        The preview shows the choice tasks once a design exists.
      </EmptyState>
    );

  const tasks = design.tasks.filter((t) => t.block === block);
  const task = tasks[Math.min(taskIndex, tasks.length - 1)];
  const alternatives: ChoiceTaskAlternative[] = [
    ...task.alternatives.map((a, j) => ({
      kind: 'designed' as const,
      designIndex: j,
      levels: a.levels,
    })),
    ...(study.definition.fixedAlternative ? [{ kind: 'fixed' as const }] : []),
  ];
  const position = tasks.indexOf(task) + 1;
  const card = (
    <ChoiceTaskCard
      definition={study.definition}
      alternatives={alternatives}
      selectedIndex={chosen}
      onChoose={setChosen}
      label={`Task ${position} of ${tasks.length}`}
    />
  );
  const heading = (
    <div className="mb-3">
      <div className="mb-2 h-1 w-full rounded-full bg-line" aria-hidden>
        <div
          className="h-1 rounded-full bg-primary"
          style={{ width: `${(position / tasks.length) * 100}%` }}
        />
      </div>
      <p className="text-xs text-ink-muted">
        Task {position} of {tasks.length}
      </p>
      <p className="text-base font-semibold text-ink">Which option would you choose?</p>
    </div>
  );

  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end gap-3">
        <SelectField
          label="Block"
          wrapperClassName="w-32"
          value={block}
          onChange={(e) => {
            setBlock(Number(e.target.value));
            setTaskIndex(0);
            setChosen(null);
          }}
        >
          {Array.from({ length: design.blocks }, (_, b) => (
            <option key={b} value={b + 1}>
              Block {b + 1}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Task"
          wrapperClassName="w-52"
          value={taskIndex}
          onChange={(e) => {
            setTaskIndex(Number(e.target.value));
            setChosen(null);
          }}
        >
          {tasks.map((t, i) => (
            <option key={t.task} value={i}>
              Task {i + 1} (design #{t.task})
            </option>
          ))}
        </SelectField>
        <p className="pb-2 text-xs text-ink-muted">Tap an option to see how a choice looks.</p>
      </div>
      <div className="flex flex-col gap-8">
        <section aria-label="Phone preview" className="shrink-0">
          <h2 className="mb-2 text-sm font-semibold text-ink-soft">Phone (360 px)</h2>
          <div className="w-[360px] max-w-full overflow-hidden rounded-[2rem] border-8 border-ink bg-canvas shadow-lg">
            <div className="max-h-[640px] overflow-y-auto p-3">
              {heading}
              {card}
            </div>
          </div>
        </section>
        <section aria-label="Desktop preview" className="min-w-0">
          <h2 className="mb-2 text-sm font-semibold text-ink-soft">Desktop</h2>
          <div className="overflow-x-auto rounded-lg border border-line bg-canvas">
            <div className="mx-auto min-w-[720px] max-w-5xl p-6">
              {heading}
              {card}
            </div>
          </div>
        </section>
      </div>
    </div>
  );
}
