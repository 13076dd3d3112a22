/**
 * The respondent app's state: boots the session (resuming where the respondent left off),
 * records each answer into the persistent outbox at once, and sends the outbox in order,
 * retrying with backoff until the server acknowledges. Screens never wait for the network,
 * except screening questions, whose outcome decides whether the respondent goes on.
 */
import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState } from 'react';
import { ApiError } from '@/lib/api-client';
import type {
  AnswerReceipt,
  AnswerValue,
  RespondentScreen,
  RespondentSession,
  RespondentStatus,
  SurveyLinkInfo,
  SurveyLinkState,
} from '@shared/schemas/respondent';
import { getSurveyLink } from '../api/get-survey-link';
import { startSessionOnce } from '../api/start-session';
import { getSession } from '../api/get-session';
import { submitAnswer } from '../api/submit-answer';
import { chooseLanguage } from '../api/choose-language';
import {
  answerToSend,
  enqueueAnswer,
  enqueueRevision,
  keepOutboxOf,
  markUnsent,
  newClientId,
  readOutbox,
  readUnsent,
  removeAnswer,
  retryDelayMs,
  saveToken,
  type UnsentAnswer,
} from '../utils/respondent-storage';
import { useGoingBack } from './use-going-back';
import { ruleOfScreen, screenApplies } from '@shared/survey/skip-logic';

export type Unavailable = SurveyLinkState | 'not_found' | 'session_lost';

export type RespondentState =
  | { phase: 'loading' }
  | {
      phase: 'unavailable';
      reason: Unavailable;
      studyName: string | null;
      redirectUrl: string | null;
      /** A closed or full survey's page in the link's language (the study's own words). */
      page?: SurveyLinkInfo['page'];
    }
  | { phase: 'error'; message: string }
  | { phase: 'active'; session: RespondentSession };

const EARLIER_SESSION =
  'These answers belonged to an earlier visit on this device that the survey no longer knows.';

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
  const [unsent, setUnsent] = useState<UnsentAnswer[]>(() => readUnsent(publicId));
  const token = useRef<string | null>(null);
  const session = state.phase === 'active' ? state.session : null;
  const done = useMemo(() => new Set(answeredLocally), [answeredLocally]);
  const back = useGoingBack(publicId, session, done, finalStatus !== null);
  const { adoptGiven, remember, moveOnFrom, changed } = back;

  const pump = useRef({
    running: false,
    attempt: 0,
    timer: 0 as ReturnType<typeof setTimeout> | 0,
  });

  const adopt = useCallback(
    (session: RespondentSession) => {
      token.current = session.sessionToken;
      saveToken(publicId, session.sessionToken);
      const queued = keepOutboxOf(publicId, session.sessionToken, EARLIER_SESSION).map(
        (i) => i.answer.screenKey,
      );
      setUnsent(readUnsent(publicId));
      setAnsweredLocally([...new Set([...session.answered, ...queued])]);
      adoptGiven(session);
      setPending(queued.length);
      if (session.status !== 'in_progress') {
        setFinalStatus(session.status);
        setRedirectUrl(session.redirectUrl);
      }
      setState({ phase: 'active', session });
    },
    [publicId, adoptGiven],
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
    let refused = false;
    try {
      for (;;) {
        const item = readOutbox(publicId)[0];
        if (!item) break;
        try {
          const receipt = await submitAnswer(publicId, item.token, answerToSend(item), item.revise);
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
          // The server refused this answer for good (the survey closed before it was given,
          // the session ended, the screen already has an answer …): keep it in the unsent
          // list with the server's reason, go on with the next one, and re-read the session.
          const reason =
            err instanceof ApiError ? err.message : 'The survey could not store this answer.';
          setUnsent(markUnsent(publicId, item, reason));
          setAwaiting(null);
          refused = true;
        }
      }
      if (refused) await resync();
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
            page: link?.page ?? null,
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

  /** The first screen's language choice: the session comes back in that language. */
  const changeLanguage = useCallback(
    async (language: string) => {
      if (!token.current) return;
      try {
        adopt(await chooseLanguage(publicId, token.current, language));
      } catch {
        // Refused (an answer got there first) or offline: the session as the server has it.
        await resync();
      }
    },
    [adopt, publicId, resync],
  );

  const answer = useCallback(
    (screen: RespondentScreen, value: AnswerValue, responseMs: number) => {
      if (!token.current) return;
      const item = {
        token: token.current,
        givenAt: Date.now(),
        answer: {
          clientId: newClientId(),
          screenKey: screen.key,
          value,
          responseMs: Math.round(responseMs),
        },
      };
      if (done.has(screen.key)) {
        // A screen seen again through Back: only a changed answer is sent, as a revision.
        if (changed(screen.key, value)) {
          enqueueRevision(publicId, item);
          remember(screen.key, value);
          setPending(readOutbox(publicId).length);
          void sendOutbox();
        }
        moveOnFrom(screen.key);
        return;
      }
      remember(screen.key, value);
      enqueueAnswer(publicId, item);
      // A screening answer decides whether the respondent continues: wait for its receipt.
      if (screen.kind === 'question' && screen.screening) setAwaiting(screen.key);
      setAnsweredLocally((keys) => (keys.includes(screen.key) ? keys : [...keys, screen.key]));
      setPending((n) => n + 1);
      void sendOutbox();
    },
    [publicId, sendOutbox, done, changed, remember, moveOnFrom],
  );

  // A page whose skip rule does not match is gone past at once, stored as skipped (before
  // paint, so it never flashes). Not while a screening answer awaits its receipt: a respondent
  // screened out there has no later pages.
  const current = back.currentScreen;
  const skipCurrent =
    !!current &&
    awaiting === null &&
    finalStatus === null &&
    !done.has(current.key) &&
    !screenApplies(ruleOfScreen(current), back.given);
  useLayoutEffect(() => {
    if (skipCurrent && current) answer(current, { kind: 'skipped' }, 0);
  }, [skipCurrent, current, answer]);

  return {
    state,
    currentScreen: skipCurrent ? null : current,
    /** True while the app goes past a page that does not apply (nothing to show). */
    skipping: skipCurrent,
    answeredCount: answeredLocally.length,
    totalScreens: session?.screens.length ?? 0,
    pending,
    offline,
    finalStatus,
    redirectUrl,
    awaitingReceipt: awaiting !== null,
    unsent,
    answer,
    changeLanguage,
    /** The answer given earlier on the current screen (seen again through Back), if known. */
    givenOnCurrent: back.givenOnCurrent,
    goBack: back.goBack,
  };
}
