/**
 * /preview/:teamId/:studyId?block&seed&screen — the respondent app's own layout and screens,
 * fed by the study's preview (the same screen-building code as a live session) instead of a
 * session. Shown in an iframe by the Preview section, so phone widths are real viewports.
 * Answers only move on to the next screen; nothing is sent or stored.
 */
import { useEffect, useState } from 'react';
import { useParams, useSearchParams } from 'react-router';
import { ApiError } from '@/lib/api-client';
import { Spinner } from '@/components/ui/feedback';
import { useStudyPreview } from '@/features/preview/api/get-study-preview';
import { postPreviewScreen } from '@/features/preview/utils/preview-messages';
import { RespondLayout } from '@/features/respond/components/respond-layout';
import { RespondentScreenView } from '@/features/respond/components/screen-view';
import { EndScreen } from '@/features/respond/components/finish-screens';
import { Paragraphs, ScreenFrame } from '@/features/respond/components/screen-frame';

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
  const preview = useStudyPreview(teamId, studyId, block, seed);
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
  return (
    <RespondLayout progress={index / survey.screens.length} studyName={survey.studyName}>
      {screen ? (
        <RespondentScreenView
          key={screen.key}
          screen={screen}
          definition={survey.definition}
          onAnswer={() => setIndex(index + 1)}
        />
      ) : (
        <EndScreen status="completed" pending={0} end={survey.end} redirectUrl={null} />
      )}
    </RespondLayout>
  );
}
