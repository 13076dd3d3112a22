/**
 * /preview/:teamId/:studyId?block&seed&screen — the respondent app's own layout and screens,
 * fed by the study's preview (the same screen-building code as a live session) instead of a
 * session. Shown in an iframe by the Preview section, so phone widths are real viewports.
 * Answers only move on to the next screen (Back works as in a live session); nothing is sent
 * or stored.
 */
import { useEffect, useState } from 'react';
import type { AnswerValue } from '@shared/schemas/respondent';
import { previousRevisable } from '@shared/survey/going-back';
import { useParams, useSearchParams } from 'react-router';
import { ApiError } from '@/lib/api-client';
import { Spinner } from '@/components/ui/feedback';
import { useStudyPreview } from '@/features/preview/api/get-study-preview';
import { postPreviewScreen } from '@/features/preview/utils/preview-messages';
import { RespondLayout } from '@/features/respond/components/respond-layout';
import { isWideScreen, RespondentScreenView } from '@/features/respond/components/screen-view';
import { nextShownIndex } from '@shared/survey/skip-logic';
import { EndScreen } from '@/features/respond/components/finish-screens';
import { GoBackContext, Paragraphs, ScreenFrame } from '@/features/respond/components/screen-frame';
import { useDocumentLanguage } from '@/features/respond/hooks/use-document-language';
import { InterfaceTextsContext } from '@/lib/interface-texts';

const whole = (text: string | null, fallback: number) => {
  const n = Number(text);
  return Number.isInteger(n) && n >= 0 ? n : fallback;
};

export function Component() {
  const { teamId = '', studyId = '' } = useParams();
  const [search] = useSearchParams();
  const block = Math.max(1, whole(search.get('block'), 1));
  const seed = whole(search.get('seed'), 1);
  const [index, setIndex] = useState(() => whole(search.get('screen'), 0));
  // As in a live session: progress counts screens answered, Back shows the answer given.
  const [furthest, setFurthest] = useState(index);
  const [given, setGiven] = useState<Record<string, AnswerValue>>({});
  const lang = search.get('lang') ?? undefined;
  const preview = useStudyPreview(teamId, studyId, block, seed, lang);
  useDocumentLanguage(preview.data?.survey.language ?? null, preview.data?.survey.dir ?? null);
  useEffect(() => postPreviewScreen(index), [index]);

  if (preview.isPending)
    return (
      <RespondLayout progress={0}>
        <Spinner label="Opening the survey…" />
      </RespondLayout>
    );
  if (preview.error)
    return (
      <RespondLayout progress={0}>
        <ScreenFrame title="Nothing to preview yet">
          <Paragraphs
            text={
              preview.error instanceof ApiError
                ? preview.error.message
                : 'The preview could not be loaded.'
            }
          />
        </ScreenFrame>
      </RespondLayout>
    );
  const { survey } = preview.data;
  const screen = survey.screens[index];
  const answered = new Set(survey.screens.slice(0, furthest).map((s) => s.key));
  const back = screen && previousRevisable(survey.screens, answered, screen.key, survey.back);
  const goBack = back ? () => setIndex(survey.screens.indexOf(back)) : null;
  return (
    <InterfaceTextsContext.Provider value={survey.ui}>
      <RespondLayout
        progress={furthest / survey.screens.length}
        studyName={survey.studyName}
        wide={isWideScreen(screen)}
      >
        {screen ? (
          <GoBackContext.Provider value={goBack}>
            <RespondentScreenView
              key={screen.key}
              screen={screen}
              definition={survey.definition}
              initial={given[screen.key]}
              onAnswer={(value) => {
                const now = { ...given, [screen.key]: value };
                setGiven(now);
                // A screen seen again leads back on to the next one, as in the live app; pages
                // whose skip rule does not match are gone past.
                const next = nextShownIndex(survey.screens, index + 1, now);
                setIndex(next);
                setFurthest((f) => Math.max(f, next));
              }}
            />
          </GoBackContext.Provider>
        ) : (
          <EndScreen status="completed" pending={0} end={survey.end} redirectUrl={null} />
        )}
      </RespondLayout>
    </InterfaceTextsContext.Provider>
  );
}
