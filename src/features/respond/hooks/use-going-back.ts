/**
 * Back in the respondent app: which screen is shown when the respondent went back, where Back
 * leads from it (shared/survey/going-back.ts, the rule the server enforces too), and the
 * answers given earlier so a screen seen again shows what was chosen. The answers come from the
 * session (the server's current ones) overlaid with this device's own, which may still wait in
 * the outbox.
 */
import { useCallback, useMemo, useState } from 'react';
import type { AnswerValue, RespondentScreen, RespondentSession } from '@shared/schemas/respondent';
import { previousRevisable } from '@shared/survey/going-back';
import { readGiven, saveGiven } from '../utils/respondent-storage';

export function useGoingBack(
  publicId: string,
  session: RespondentSession | null,
  answered: ReadonlySet<string>,
  finished: boolean,
) {
  /** An answered screen the respondent went back to, or null at the first unanswered one. */
  const [reviewing, setReviewing] = useState<string | null>(null);
  const [given, setGiven] = useState<Record<string, AnswerValue>>({});

  const adoptGiven = useCallback(
    (s: RespondentSession) => setGiven({ ...s.given, ...readGiven(publicId, s.sessionToken) }),
    [publicId],
  );

  const currentScreen: RespondentScreen | null = useMemo(() => {
    if (!session) return null;
    const back = reviewing ? session.screens.find((s) => s.key === reviewing) : undefined;
    return back ?? session.screens.find((s) => !answered.has(s.key)) ?? null;
  }, [session, answered, reviewing]);

  const backTarget =
    session && currentScreen && !finished
      ? previousRevisable(session.screens, answered, currentScreen.key, session.back)
      : null;
  const goBack = useCallback(() => {
    if (backTarget) setReviewing(backTarget.key);
  }, [backTarget]);

  const remember = useCallback(
    (key: string, value: AnswerValue) =>
      setGiven((g) => {
        const next = { ...g, [key]: value };
        if (session) saveGiven(publicId, session.sessionToken, next);
        return next;
      }),
    [publicId, session],
  );

  /** After a screen seen again: the next answered screen, or on to the first unanswered. */
  const moveOnFrom = useCallback(
    (key: string) => {
      const screens = session?.screens ?? [];
      const next = screens[screens.findIndex((s) => s.key === key) + 1];
      setReviewing(next && answered.has(next.key) ? next.key : null);
    },
    [session, answered],
  );

  /** True when `value` differs from what was given on that screen before. */
  const changed = useCallback(
    (key: string, value: AnswerValue) => JSON.stringify(given[key]) !== JSON.stringify(value),
    [given],
  );

  return {
    currentScreen,
    goBack: backTarget ? goBack : null,
    givenOnCurrent: currentScreen ? given[currentScreen.key] : undefined,
    /** Every answer this device knows, by screen key (skip rules read them). */
    given,
    adoptGiven,
    remember,
    moveOnFrom,
    changed,
  };
}
