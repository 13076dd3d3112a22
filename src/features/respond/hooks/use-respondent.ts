/**
 * The respondent app's state: boots the session (resuming where the respondent left off),
 * records each answer into the persistent outbox at once, and sends the outbox in order,
 * retrying with backoff until the server acknowledges. Screens never wait for the network,
 * except screening questions, whose outcome decides whether the respondent goes on.
 */
import { useCallback, useEffect, useMemo, useRef, useState } from 'react';
import { ApiError } from '@/lib/api-client';
import type {
  AnswerReceipt,
  AnswerValue,
  RespondentScreen,
  RespondentSession,
  RespondentStatus,
  SurveyLinkState,
} from '@shared/schemas/respondent';
import { getSurveyLink } from '../api/get-survey-link';
import { startSessionOnce } from '../api/start-session';
import { getSession } from '../api/get-session';
import { submitAnswer } from '../api/submit-answer';
import {
  enqueueAnswer,
  enqueueRevision,
  keepOutboxOf,
  newClientId,
  readGiven,
  readOutbox,
  removeAnswer,
  retryDelayMs,
  saveGiven,
  saveToken,
} from '../utils/respondent-storage';
import { previousRevisable } from '@shared/survey/going-back';

export type Unavailable = SurveyLinkState | 'not_found' | 'session_lost';

export type RespondentState =
  | { phase: 'loading' }
  | {
      phase: 'unavailable';
      reason: Unavailable;
      studyName: string | null;
      redirectUrl: string | null;
    }
  | { phase: 'error'; message: string }
  | { phase: 'active'; session: RespondentSession };

/** Errors that a retry cannot fix: the answer is dropped and the session re-read. */
const FINAL_CODES = new Set([
  'already_completed',
  'already_finished',
  'survey_closed',
  'survey_not_open',
  'over_quota',
  'not_found',
  'survey_not_found',
]);

function isTransient(err: unknown): boolean {
  if (!(err instanceof ApiError)) return true;
  return err.status === 0 || err.status >= 500 || err.status === 429 || err.status === 408;
}

function unavailableReason(code: string): Unavailable {
  if (code === 'survey_closed') return 'closed';
  if (code === 'over_quota') return 'over_quota';
  if (code === 'survey_not_open') return 'not_open';
  return 'not_found';
}

export function useRespondent(publicId: string, search: string) {
  const [state, setState] = useState<RespondentState>({ phase: 'loading' });
  const [answeredLocally, setAnsweredLocally] = useState<string[]>([]);
  const [pending, setPending] = useState(0);
  const [offline, setOffline] = useState(false);
  const [finalStatus, setFinalStatus] = useState<RespondentStatus | null>(null);
  const [redirectUrl, setRedirectUrl] = useState<string | null>(null);
  const [awaiting, setAwaiting] = useState<string | null>(null);
  /** An answered screen the respondent went back to, or null at the first unanswered one. */
  const [reviewing, setReviewing] = useState<string | null>(null);
  const [given, setGiven] = useState<Record<string, AnswerValue>>({});
  const token = useRef<string | null>(null);
  const pump = useRef({
    running: false,
    attempt: 0,
    timer: 0 as ReturnType<typeof setTimeout> | 0,
  });

  const adopt = useCallback(
    (session: RespondentSession) => {
      token.current = session.sessionToken;
      saveToken(publicId, session.sessionToken);
      const queued = keepOutboxOf(publicId, session.sessionToken).map((i) => i.answer.screenKey);
      setAnsweredLocally([...new Set([...session.answered, ...queued])]);
      setGiven(readGiven(publicId, session.sessionToken));
      setPending(queued.length);
      if (session.status !== 'in_progress') {
        setFinalStatus(session.status);
        setRedirectUrl(session.redirectUrl);
      }
      setState({ phase: 'active', session });
    },
    [publicId],
  );

  const resync = useCallback(async () => {
    if (!token.current) return;
    try {
      adopt(await getSession(publicId, token.current));
    } catch (err) {
      if (err instanceof ApiError && err.status === 404)
        setState({
          phase: 'unavailable',
          reason: 'session_lost',
          studyName: null,
          redirectUrl: null,
        });
    }
  }, [adopt, publicId]);

  const applyReceipt = useCallback((receipt: AnswerReceipt) => {
    if (receipt.status !== 'in_progress') {
      setFinalStatus(receipt.status);
      setRedirectUrl(receipt.redirectUrl);
    }
    setAwaiting((key) => (key === receipt.screenKey ? null : key));
  }, []);

  const sendOutbox = useCallback(async () => {
    const p = pump.current;
    if (p.running) return;
    p.running = true;
    if (p.timer) clearTimeout(p.timer);
    p.timer = 0;
    try {
      for (;;) {
        const item = readOutbox(publicId)[0];
        if (!item) break;
        try {
          const receipt = await submitAnswer(publicId, item.token, item.answer, item.revise);
          removeAnswer(publicId, item.answer.clientId);
          p.attempt = 0;
          setOffline(false);
          applyReceipt(receipt);
        } catch (err) {
          if (isTransient(err)) {
            setOffline(true);
            p.timer = setTimeout(() => void sendOutbox(), retryDelayMs(p.attempt++));
            break;
          }
          // The server already holds an answer for this screen, or the session ended:
          // drop what cannot be stored and take the server's word for where we are.
          const code = err instanceof ApiError ? err.code : '';
          if (FINAL_CODES.has(code)) keepOutboxOf(publicId, null);
          else removeAnswer(publicId, item.answer.clientId);
          setAwaiting(null);
          await resync();
        }
      }
    } finally {
      p.running = false;
      setPending(readOutbox(publicId).filter((i) => i.token === token.current).length);
    }
  }, [applyReceipt, publicId, resync]);

  useEffect(() => {
    let cancelled = false;
    (async () => {
      try {
        // Straight to the session: on a slow connection every round trip counts, and a survey
        // that is not open answers this request with its reason anyway.
        const session = await startSessionOnce(publicId, search);
        if (cancelled) return;
        adopt(session);
        void sendOutbox();
      } catch (err) {
        if (cancelled) return;
        if (err instanceof ApiError && err.status >= 400 && err.status < 500) {
          const reason = unavailableReason(err.code);
          // Closed or full surveys may send panel respondents back: the link info has the address.
          const link =
            reason === 'not_found' ? null : await getSurveyLink(publicId, search).catch(() => null);
          if (cancelled) return;
          setState({
            phase: 'unavailable',
            reason: link && link.state !== 'live' ? link.state : reason,
            studyName: link?.studyName ?? null,
            redirectUrl: link?.redirectUrl ?? null,
          });
        } else
          setState({
            phase: 'error',
            message: err instanceof Error ? err.message : 'Something went wrong.',
          });
      }
    })();
    return () => {
      cancelled = true;
    };
  }, [adopt, publicId, search, sendOutbox]);

  useEffect(() => {
    const retryNow = () => {
      pump.current.attempt = 0;
      void sendOutbox();
    };
    window.addEventListener('online', retryNow);
    return () => window.removeEventListener('online', retryNow);
  }, [sendOutbox]);

  const session = state.phase === 'active' ? state.session : null;
  const done = useMemo(() => new Set(answeredLocally), [answeredLocally]);
  const currentScreen: RespondentScreen | null = useMemo(() => {
    if (!session) return null;
    const back = reviewing && session.screens.find((s) => s.key === reviewing);
    return back || (session.screens.find((s) => !done.has(s.key)) ?? null);
  }, [session, done, reviewing]);
  const backTarget =
    session && currentScreen && finalStatus === null
      ? previousRevisable(session.screens, done, currentScreen.key, session.back)
      : null;
  const goBack = useCallback(() => {
    if (backTarget) setReviewing(backTarget.key);
  }, [backTarget]);

  const remember = useCallback(
    (key: string, value: AnswerValue) =>
      setGiven((g) => {
        const next = { ...g, [key]: value };
        if (token.current) saveGiven(publicId, token.current, next);
        return next;
      }),
    [publicId],
  );

  /** After a screen seen again: the next answered screen, or back to the first unanswered. */
  const moveOnFrom = useCallback(
    (key: string) => {
      const screens = session?.screens ?? [];
      const next = screens[screens.findIndex((s) => s.key === key) + 1];
      setReviewing(next && done.has(next.key) ? next.key : null);
    },
    [session, done],
  );

  const answer = useCallback(
    (screen: RespondentScreen, value: AnswerValue, responseMs: number) => {
      if (!token.current) return;
      if (done.has(screen.key)) {
        // A screen seen again through Back: only a changed answer is sent, as a revision.
        if (JSON.stringify(given[screen.key]) !== JSON.stringify(value)) {
          enqueueRevision(publicId, {
            token: token.current,
            answer: {
              clientId: newClientId(),
              screenKey: screen.key,
              value,
              responseMs: Math.round(responseMs),
            },
          });
          remember(screen.key, value);
          setPending(readOutbox(publicId).length);
          void sendOutbox();
        }
        moveOnFrom(screen.key);
        return;
      }
      remember(screen.key, value);
      enqueueAnswer(publicId, {
        token: token.current,
        answer: {
          clientId: newClientId(),
          screenKey: screen.key,
          value,
          responseMs: Math.round(responseMs),
        },
      });
      // A screening answer decides whether the respondent continues: wait for its receipt.
      if (screen.kind === 'question' && screen.screening) setAwaiting(screen.key);
      setAnsweredLocally((keys) => (keys.includes(screen.key) ? keys : [...keys, screen.key]));
      setPending((n) => n + 1);
      void sendOutbox();
    },
    [publicId, sendOutbox, done, given, remember, moveOnFrom],
  );

  return {
    state,
    currentScreen,
    answeredCount: answeredLocally.length,
    totalScreens: session?.screens.length ?? 0,
    pending,
    offline,
    finalStatus,
    redirectUrl,
    awaitingReceipt: awaiting !== null,
    answer,
    /** The answer given earlier on the current screen (seen again through Back), if known. */
    givenOnCurrent: currentScreen ? given[currentScreen.key] : undefined,
    goBack: backTarget ? goBack : null,
  };
}
