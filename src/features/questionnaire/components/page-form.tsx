import { TextAreaField, TextField } from '@/components/ui/field';
import { NumberTextField } from '@/components/ui/number-text-field';
import { NumberRangeFields } from '@/components/ui/number-range-fields';
import {
  pageKindLabels,
  type Question,
  type QuestionnairePage,
} from '@shared/schemas/questionnaire';
import type { StudyDefinition } from '@shared/schemas/study-definition';
import { templateHelp, templateLabels } from '@shared/schemas/questionnaire-templates';
import { CertaintyFields } from './certainty-fields';
import { QuestionFields } from './question-fields';
import { QuotaFields } from './quota-fields';
import { OptionCheckboxes } from './option-checkboxes';
import { ShowIfFields } from './show-if-fields';
import { DominanceFields, HandSetTaskFields } from './task-page-fields';

const kindHelp: Partial<Record<QuestionnairePage['kind'], string>> = {
  consent:
    'Respondents must agree before anything else. Say who runs the study, what is recorded, how long it is kept, that taking part is voluntary and that they may stop at any time. Follow your ethics board and data-protection law.',
  tasks:
    "Each respondent sees their block's choice tasks here, one per screen, in the order set under Randomisation.",
  warmup:
    'A hand-set practice task shown before the design tasks. It is stored but not used in estimation.',
  holdout:
    'A hand-set task every respondent sees. It is kept out of estimation to check predictions.',
  repeat:
    'Shows one of the respondent’s design tasks again with the alternatives in swapped positions, to check consistency.',
  dominance: 'One alternative is better on every attribute: a check of attention.',
  screening: 'Respondents whose answer matches a screen-out rule leave the survey here.',
};

export function PageForm({
  page,
  definition,
  onChange,
  otherKeys = [],
  earlier = [],
}: {
  page: QuestionnairePage;
  definition: StudyDefinition;
  onChange: (p: QuestionnairePage) => void;
  /** Question keys used by the other pages. */
  otherKeys?: string[];
  /** Choice and number questions on the pages before this one (skip rules read them). */
  earlier?: Question[];
}) {
  const template =
    page.kind === 'question' || page.kind === 'instructions' ? page.template : undefined;
  const titled = (
    <TextField
      label="Title"
      value={'title' in page ? page.title : ''}
      onChange={(e) => onChange({ ...page, title: e.target.value } as QuestionnairePage)}
    />
  );
  return (
    <div className="space-y-4">
      <div>
        <h3 className="text-base font-semibold text-ink">
          {template ? templateLabels[template] : pageKindLabels[page.kind]}
        </h3>
        {template ? (
          <p className="mt-1 text-sm text-ink-soft">{templateHelp[template]}</p>
        ) : (
          kindHelp[page.kind] && <p className="mt-1 text-sm text-ink-soft">{kindHelp[page.kind]}</p>
        )}
      </div>
      {(page.kind === 'consent' || page.kind === 'instructions' || page.kind === 'end') && (
        <>
          {titled}
          <TextAreaField
            label="Text"
            hint="A blank line starts a new paragraph."
            className="min-h-48"
            value={page.body}
            onChange={(e) => onChange({ ...page, body: e.target.value })}
          />
        </>
      )}
      {page.kind === 'consent' && (
        <TextField
          label="Agreement checkbox"
          value={page.agreeLabel}
          onChange={(e) => onChange({ ...page, agreeLabel: e.target.value })}
        />
      )}
      {(page.kind === 'tasks' || page.kind === 'repeat') && titled}
      {page.kind === 'tasks' && <CertaintyFields page={page} onChange={onChange} />}
      {page.kind === 'repeat' && (
        <NumberTextField
          label="Repeat the respondent's task number"
          integer
          required
          range={{ min: 1, max: 100 }}
          value={page.repeatOf}
          hint="1 repeats the first task they answered."
          onCommit={(n) => onChange({ ...page, repeatOf: n ?? page.repeatOf })}
        />
      )}
      {(page.kind === 'warmup' || page.kind === 'holdout') && (
        <>
          {titled}
          <HandSetTaskFields page={page} definition={definition} onChange={onChange} />
        </>
      )}
      {page.kind === 'dominance' && (
        <>
          {titled}
          <DominanceFields page={page} definition={definition} onChange={onChange} />
        </>
      )}
      {(page.kind === 'question' || page.kind === 'screening') && (
        <QuestionFields
          question={page.question}
          allowText={page.kind === 'question'}
          otherKeys={otherKeys}
          onChange={(question) => onChange({ ...page, question } as QuestionnairePage)}
        />
      )}
      {page.kind === 'screening' &&
        (page.question.type === 'single' || page.question.type === 'multiple') && (
          <fieldset className="space-y-2">
            <legend className="mb-1 text-sm font-medium text-ink">
              Screen out respondents who choose
            </legend>
            <OptionCheckboxes
              options={page.question.options}
              selected={page.screenOutOptionIds}
              onChange={(screenOutOptionIds) => onChange({ ...page, screenOutOptionIds })}
            />
          </fieldset>
        )}
      {page.kind === 'screening' && page.question.type === 'number' && (
        <NumberRangeFields
          labels={{
            low: 'Accept from (empty: no lower limit)',
            high: 'Accept up to (empty: no upper limit)',
          }}
          limits={{ low: page.acceptMin, high: page.acceptMax }}
          onCommit={({ low, high }) => onChange({ ...page, acceptMin: low, acceptMax: high })}
        />
      )}
      {page.kind === 'screening' && <QuotaFields page={page} onChange={onChange} />}
      {(page.kind === 'question' || page.kind === 'screening' || page.kind === 'instructions') && (
        <ShowIfFields
          showIf={page.showIf}
          earlier={earlier}
          onChange={(showIf) => onChange({ ...page, showIf })}
        />
      )}
    </div>
  );
}
