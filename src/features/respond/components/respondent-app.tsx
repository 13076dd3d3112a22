import { Spinner } from '@/components/ui/feedback';
import { useRespondent } from '../hooks/use-respondent';
import { isWideScreen, RespondentScreenView } from './screen-view';
import { EndScreen, UnavailableScreen } from './finish-screens';
import { RespondLayout } from './respond-layout';
import { UnsentNotice } from './unsent-notice';
import { GoBackContext } from './screen-frame';
import { LanguageChoice } from './language-choice';
import { InterfaceTextsContext } from '@/lib/interface-texts';
import { useDocumentLanguage } from '../hooks/use-document-language';

/** The respondent app for one public link: one screen at a time, every answer kept. */
export function RespondentApp({ publicId, search }: { publicId: string; search: string }) {
  const r = useRespondent(publicId, search);
  const { state } = r;
  const session = state.phase === 'active' ? state.session : null;
  // Before a session, a closed or full survey's page may come in the link's language.
  const page = state.phase === 'unavailable' ? state.page : null;
  useDocumentLanguage(
    session?.language ?? page?.language ?? null,
    session?.dir ?? page?.dir ?? null,
  );

  if (state.phase === 'loading')
    return (
      <RespondLayout progress={0}>
        <Spinner label="Opening the survey…" />
      </RespondLayout>
    );
  if (state.phase === 'error')
    return (
      <RespondLayout progress={0}>
        <UnavailableScreen reason="not_found" studyName={null} redirectUrl={null} />
        <p className="mx-auto mt-4 max-w-2xl text-sm text-ink-muted">{state.message}</p>
      </RespondLayout>
    );
  if (state.phase === 'unavailable')
    return (
      <RespondLayout progress={0}>
        <UnavailableScreen {...state} />
      </RespondLayout>
    );

  if (!session) return null;
  const progress = r.totalScreens ? r.answeredCount / r.totalScreens : 0;
  const finished = r.finalStatus !== null && r.finalStatus !== 'in_progress';
  const closedUnderfoot = !session.surveyOpen && !finished;
  const status = {
    pending: r.pending,
    offline: r.offline,
  };
  const endScreen = (
    <EndScreen
      status={r.finalStatus}
      pending={r.pending}
      end={session.end}
      redirectUrl={r.redirectUrl}
    />
  );
  let body;
  let wide = false;
  if (closedUnderfoot && r.pending > 0)
    body = <Spinner label="Sending the answers you gave before the survey closed…" />;
  else if (closedUnderfoot)
    body = <UnavailableScreen reason="closed" studyName={session.studyName} redirectUrl={null} />;
  else if (r.awaitingReceipt && !finished) body = <Spinner label={session.ui['ui.checking']} />;
  else if (finished && r.finalStatus !== 'completed') body = endScreen;
  else if (r.skipping) body = null;
  else if (!r.currentScreen) body = endScreen;
  else {
    wide = isWideScreen(r.currentScreen);
    body = (
      <GoBackContext.Provider value={r.goBack}>
        <RespondentScreenView
          key={r.currentScreen.key}
          screen={r.currentScreen}
          definition={session.definition}
          onAnswer={(value, ms) => r.answer(r.currentScreen!, value, ms)}
          initial={r.givenOnCurrent}
        />
      </GoBackContext.Provider>
    );
  }
  // A link with ?lang= has chosen already; otherwise the first screen offers the languages.
  const choosing =
    session.languages.length > 1 &&
    r.answeredCount === 0 &&
    !finished &&
    !new URLSearchParams(search).has('lang');
  return (
    <InterfaceTextsContext.Provider value={session.ui}>
      <RespondLayout
        progress={finished ? 1 : progress}
        studyName={session.studyName}
        wide={wide}
        {...status}
      >
        <UnsentNotice unsent={r.unsent} />
        {choosing && (
          <LanguageChoice
            languages={session.languages}
            current={session.language}
            label={session.ui['ui.language']}
            onChoose={r.changeLanguage}
          />
        )}
        {body}
      </RespondLayout>
    </InterfaceTextsContext.Provider>
  );
}
