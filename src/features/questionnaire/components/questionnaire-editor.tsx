import { useMemo, useState } from 'react';
import { Button } from '@/components/ui/button';
import { Alert, Card } from '@/components/ui/feedback';
import { SelectField } from '@/components/ui/field';
import { ApiError } from '@/lib/api-client';
import {
  pageKindLabels,
  questionnaireSchema,
  type PageKind,
  type Questionnaire,
  type QuestionnaireOptions,
  type QuestionnairePage,
  type TemplateKind,
} from '@shared/schemas/questionnaire';
import { createPage } from '@shared/schemas/questionnaire-defaults';
import {
  availableTemplates,
  createTemplatePage,
  templateLabels,
} from '@shared/schemas/questionnaire-templates';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { useSaveQuestionnaire } from '../api/save-questionnaire';
import { NavigationOptions } from './navigation-options';
import { RandomisationOptions } from './randomisation-options';
import { PageForm } from './page-form';
import { PageList } from './page-list';
import { Options } from '@/components/ui/options';

const addable: PageKind[] = [
  'screening',
  'question',
  'instructions',
  'warmup',
  'holdout',
  'repeat',
  'dominance',
];
const required = new Set<PageKind>(['consent', 'tasks', 'end']);

const questionKeys = (pages: QuestionnairePage[]) =>
  pages.flatMap((p) => (p.kind === 'question' || p.kind === 'screening' ? [p.question.key] : []));

/** Page kinds and follow-up templates offered by "Add a page" (select values). */
type AddChoice = PageKind | `template:${TemplateKind}`;

/**
 * Where a new page goes: warm-ups, screening and scripts read before the tasks go just before
 * them; checks and debrief questions after them; everything before the end.
 */
function insertPage(pages: QuestionnairePage[], page: QuestionnairePage): QuestionnairePage[] {
  const tasksAt = pages.findIndex((p) => p.kind === 'tasks');
  const endAt = pages.findIndex((p) => p.kind === 'end');
  const beforeTasks =
    page.kind === 'warmup' ||
    page.kind === 'screening' ||
    (page.kind === 'instructions' &&
      (page.template === 'cheap_talk' || page.template === 'budget_reminder'));
  const at = beforeTasks ? Math.max(1, tasksAt) : endAt < 0 ? pages.length : endAt;
  return [...pages.slice(0, at), page, ...pages.slice(at)];
}

/** The questionnaire editor: page order on the left, the selected page's fields on the right. */
export function QuestionnaireEditor({
  teamId,
  studyId,
  initial,
  saved,
  editable,
  definition,
}: {
  teamId: string;
  studyId: string;
  initial: Questionnaire;
  saved: boolean;
  editable: boolean;
  definition: StudyDefinition;
}) {
  const [draft, setDraft] = useState(initial);
  const [dirty, setDirty] = useState(!saved);
  const [selectedId, setSelectedId] = useState<string | null>(initial.pages[0]?.id ?? null);
  const [addKind, setAddKind] = useState<AddChoice>('question');
  const save = useSaveQuestionnaire(teamId, studyId);
  const check = useMemo(() => questionnaireSchema.safeParse(draft), [draft]);
  const selected = draft.pages.find((p) => p.id === selectedId) ?? null;

  const change = (pages: QuestionnairePage[]) => {
    setDraft((d) => ({ ...d, pages }));
    setDirty(true);
  };
  const changeOptions = (options: QuestionnaireOptions) => {
    setDraft((d) => ({ ...d, options }));
    setDirty(true);
  };
  const problems = check.success ? [] : check.error.issues.map((i) => i.message);
  const serverProblems =
    save.error instanceof ApiError ? save.error.fields.map((f) => f.message) : [];

  return (
    <div className="space-y-4">
      {!editable && (
        <Alert tone="info" title="The questionnaire is frozen">
          Respondents see the version frozen when the study went live. Close the study and return it
          to draft to change it; the changes become a new version.
        </Alert>
      )}
      {editable && !saved && (
        <Alert tone="warning" title="Not saved yet">
          This is the starting questionnaire. Review the consent text with your ethics approval and
          data-protection details, then save.
        </Alert>
      )}
      <div className="grid grid-cols-1 gap-4 lg:grid-cols-[minmax(0,22rem)_minmax(0,1fr)]">
        <Card title="Pages">
          <PageList
            pages={draft.pages}
            selectedId={selectedId}
            onSelect={setSelectedId}
            onReorder={change}
            disabled={!editable}
          />
          {editable && (
            <div className="mt-4 flex items-end gap-2">
              <SelectField
                label="Add a page"
                wrapperClassName="flex-1"
                value={addKind}
                onChange={(e) => setAddKind(e.target.value as AddChoice)}
              >
                <Options items={addable.map((k) => ({ value: k, label: pageKindLabels[k] }))} />
                <optgroup label="Follow-up templates">
                  <Options
                    items={availableTemplates(definition).map((t) => ({
                      value: `template:${t}`,
                      label: templateLabels[t],
                    }))}
                  />
                </optgroup>
              </SelectField>
              <Button
                variant="secondary"
                onClick={() => {
                  const taken = questionKeys(draft.pages);
                  const page = addKind.startsWith('template:')
                    ? createTemplatePage(
                        addKind.slice('template:'.length) as TemplateKind,
                        definition,
                        taken,
                      )
                    : createPage(addKind as PageKind, definition, taken);
                  change(insertPage(draft.pages, page));
                  setSelectedId(page.id);
                }}
              >
                Add
              </Button>
            </div>
          )}
        </Card>
        <Card
          title={selected ? 'Page' : 'Choose a page'}
          actions={
            selected && editable && !required.has(selected.kind) ? (
              <Button
                variant="ghost"
                size="sm"
                onClick={() => {
                  change(draft.pages.filter((p) => p.id !== selected.id));
                  setSelectedId(draft.pages[0]?.id ?? null);
                }}
              >
                Remove page
              </Button>
            ) : undefined
          }
        >
          {selected ? (
            <fieldset disabled={!editable} className="min-w-0">
              <PageForm
                key={selected.id}
                page={selected}
                definition={definition}
                otherKeys={questionKeys(draft.pages.filter((p) => p.id !== selected.id))}
                earlier={draft.pages
                  .slice(0, draft.pages.indexOf(selected))
                  .flatMap((p) =>
                    (p.kind === 'question' || p.kind === 'screening') && p.question.type !== 'text'
                      ? [p.question]
                      : [],
                  )}
                onChange={(p) => change(draft.pages.map((x) => (x.id === p.id ? p : x)))}
              />
            </fieldset>
          ) : (
            <p className="text-sm text-ink-soft">Choose a page on the left to edit it.</p>
          )}
        </Card>
      </div>
      <div className="grid gap-4 lg:grid-cols-2">
        <Card title="Going back">
          <NavigationOptions
            options={draft.options}
            disabled={!editable}
            onChange={changeOptions}
          />
        </Card>
        <Card title="Randomisation">
          <RandomisationOptions
            options={draft.options}
            labeled={definition.alternatives.labeled}
            disabled={!editable}
            onChange={changeOptions}
          />
        </Card>
      </div>
      {editable && (
        <div className="sticky bottom-0 flex flex-wrap items-center gap-3 border-t border-line bg-canvas/95 py-3 backdrop-blur">
          <Button
            busy={save.isPending}
            disabled={!dirty || !check.success}
            onClick={() => save.mutate(draft, { onSuccess: () => setDirty(false) })}
          >
            Save questionnaire
          </Button>
          <span role="status" className="text-sm text-ink-soft">
            {problems.length > 0
              ? `${problems.length} thing${problems.length === 1 ? '' : 's'} to fix before saving`
              : dirty
                ? 'Unsaved changes'
                : 'All changes saved'}
          </span>
        </div>
      )}
      {(problems.length > 0 || serverProblems.length > 0) && (
        <Alert tone="danger" title="To fix">
          <ul className="list-disc pl-5">
            {[...new Set([...problems, ...serverProblems])].map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Alert>
      )}
    </div>
  );
}
