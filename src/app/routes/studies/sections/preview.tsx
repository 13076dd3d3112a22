/**
 * The Preview section: the respondent app itself, in a frame of a phone, tablet or desktop
 * width, walking through the study's current draft as one respondent of a block would (the
 * seed fixes their task order and card positions). Built by the same code as live sessions.
 */
import { useEffect, useState } from 'react';
import { useParams } from 'react-router';
import type { RespondentScreen } from '@shared/schemas/respondent';
import { pageKindLabels } from '@shared/schemas/questionnaire';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { Alert, Spinner } from '@/components/ui/feedback';
import { SelectField } from '@/components/ui/field';
import { Button } from '@/components/ui/button';
import { ErrorText } from '@/components/ui/error-boundary';
import { cn } from '@/lib/cn';
import { useStudyPreview } from '@/features/preview/api/get-study-preview';
import { listenToPreviewScreens } from '@/features/preview/utils/preview-messages';
import { EmptyUntilSection } from './empty-until-section';
import { Options } from '@/components/ui/options';

const widths = [
  { id: 'phone', label: 'Phone', px: 360, height: 740 },
  { id: 'tablet', label: 'Tablet', px: 768, height: 900 },
  { id: 'desktop', label: 'Desktop', px: 1280, height: 820 },
] as const;

const taskNames = {
  design: 'Choice task',
  warmup: pageKindLabels.warmup,
  holdout: pageKindLabels.holdout,
  repeat: pageKindLabels.repeat,
  dominance: pageKindLabels.dominance,
};

function screenName(screen: RespondentScreen, i: number): string {
  const n = `${i + 1}.`;
  switch (screen.kind) {
    case 'consent':
    case 'instructions':
      return `${n} ${screen.title}`;
    case 'question':
      return `${n} ${screen.screening ? 'Screening: ' : ''}${screen.question.text}`;
    case 'task':
      return `${n} ${taskNames[screen.taskKind]} (choice ${screen.taskIndex} of ${screen.taskCount})`;
  }
}

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const [block, setBlock] = useState(1);
  const [seed, setSeed] = useState(1);
  const [lang, setLang] = useState<string | undefined>(undefined);
  const [width, setWidth] = useState<(typeof widths)[number]>(widths[0]);
  // The frame starts at `start`; `shown` follows it as the researcher answers inside it.
  const [start, setStart] = useState(0);
  const [shown, setShown] = useState(0);
  const preview = useStudyPreview(teamId, studyId, block, seed, lang);
  useEffect(() => listenToPreviewScreens(setShown), []);

  if (preview.isPending) return <Spinner />;
  if (preview.error) {
    if (preview.error instanceof ApiError && preview.error.code === 'nothing_to_preview')
      return (
        <EmptyUntilSection
          teamId={teamId}
          studyId={studyId}
          title="Nothing to preview yet"
          section="tasks"
          label="Tasks"
        >
          {preview.error.message}
        </EmptyUntilSection>
      );
    return <ErrorText error={preview.error} />;
  }
  const { survey, blocks, questionnaireSaved } = preview.data;
  const jump = (index: number) => {
    setStart(index);
    setShown(index);
  };
  const src = paths.previewFrame.getHref(teamId, studyId, { block, seed, screen: start, lang });

  return (
    <div className="space-y-4">
      <Alert tone="info">
        This is the respondent app on the study as saved now, as one respondent of the chosen block
        sees it. Answers given here only move on to the next screen; nothing is stored.
        {!questionnaireSaved && ' The questionnaire has not been saved yet: this is the default.'}
      </Alert>
      <div className="flex flex-wrap items-end gap-3">
        {survey.languages.length > 1 && (
          <SelectField
            label="Language"
            wrapperClassName="w-44"
            value={survey.language}
            onChange={(e) => setLang(e.target.value)}
          >
            <Options items={survey.languages.map((l) => ({ value: l.tag, label: l.name }))} />
          </SelectField>
        )}
        <SelectField
          label="Block"
          wrapperClassName="w-32"
          value={block}
          onChange={(e) => {
            setBlock(Number(e.target.value));
            jump(0);
          }}
        >
          {Array.from({ length: blocks }, (_, b) => (
            <option key={b} value={b + 1}>
              Block {b + 1}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Screen"
          wrapperClassName="min-w-0 w-full sm:w-96"
          value={Math.min(shown, survey.screens.length)}
          onChange={(e) => jump(Number(e.target.value))}
        >
          {survey.screens.map((s, i) => (
            <option key={s.key} value={i}>
              {screenName(s, i)}
            </option>
          ))}
          <option value={survey.screens.length}>
            {survey.screens.length + 1}. {survey.end.title}
          </option>
        </SelectField>
        <Button
          variant="secondary"
          onClick={() => {
            setSeed(1 + Math.floor(Math.random() * 2_000_000_000));
            jump(0);
          }}
        >
          Another respondent
        </Button>
        <p className="pb-2 text-xs text-ink-muted">
          Respondent seed <span className="num">{seed}</span>: task order and card positions.
        </p>
      </div>
      <fieldset className="flex flex-wrap gap-2">
        <legend className="sr-only">Screen width</legend>
        {widths.map((w) => (
          <label
            key={w.id}
            className={cn(
              'flex h-10 cursor-pointer items-center gap-2 rounded-md border px-3 text-sm has-[:focus-visible]:ring-2 has-[:focus-visible]:ring-primary/40',
              width.id === w.id
                ? 'border-primary bg-primary-soft text-primary'
                : 'border-line bg-white text-ink',
            )}
          >
            <input
              type="radio"
              name="preview-width"
              className="sr-only"
              checked={width.id === w.id}
              onChange={() => setWidth(w)}
            />
            {w.label} <span className="num text-xs text-ink-muted">{w.px} px</span>
          </label>
        ))}
      </fieldset>
      <div
        className="overflow-x-auto rounded-lg bg-line/40 p-3"
        tabIndex={0}
        role="region"
        aria-label={`Respondent screen at ${width.px} px`}
      >
        <div
          className={cn(
            'mx-auto w-fit overflow-hidden bg-canvas shadow-lg',
            width.id === 'phone' ? 'rounded-[2rem] border-8 border-ink' : 'rounded-md',
          )}
        >
          <iframe
            key={src}
            title={`Respondent screen preview, ${width.label.toLowerCase()} width`}
            src={src}
            style={{ width: width.px, height: width.height }}
            className="block max-w-none border-0"
          />
        </div>
      </div>
    </div>
  );
}
