import { useEffect } from 'react';
import { Spinner } from '@/components/ui/feedback';
import type { RespondentStatus } from '@shared/schemas/respondent';
import type { Unavailable } from '../hooks/use-respondent';
import { Paragraphs, ScreenFrame } from './screen-frame';
import { useInterfaceText } from '@/lib/interface-texts';

/** Sends panel respondents back to their panel a moment after the last screen. */
function useRedirect(url: string | null, ready: boolean) {
  useEffect(() => {
    if (!url || !ready) return;
    const t = setTimeout(() => window.location.assign(url), 2500);
    return () => clearTimeout(t);
  }, [url, ready]);
}

function RedirectNote({ url }: { url: string | null }) {
  const t = useInterfaceText();
  if (!url) return null;
  return (
    <p className="mt-6 text-sm text-ink-soft">
      {t('ui.redirect_note')}{' '}
      <a href={url} className="font-medium text-primary underline">
        {t('ui.continue_now')}
      </a>
    </p>
  );
}

type EndProps = {
  status: RespondentStatus | null;
  pending: number;
  end: { title: string; body: string };
  redirectUrl: string | null;
};

/** The end page. It says "saved" only once the server has every answer. */
export function EndScreen({ status, pending, end, redirectUrl }: EndProps) {
  const t = useInterfaceText();
  const saved = pending === 0 && status !== null && status !== 'in_progress';
  useRedirect(redirectUrl, saved);
  // Screened out or over quota: that way out's own title and text.
  if (status === 'screened_out' || status === 'over_quota')
    return (
      <ScreenFrame title={t(`ui.${status}_title`)}>
        <Paragraphs text={t(`ui.${status}_body`)} />
        <RedirectNote url={redirectUrl} />
      </ScreenFrame>
    );
  return (
    <ScreenFrame title={end.title}>
      {saved ? (
        <Paragraphs text={end.body} />
      ) : (
        <div className="space-y-3">
          <Spinner label={t('ui.saving')} />
          <p className="text-sm text-ink-soft">{t('ui.saving_note')}</p>
        </div>
      )}
      {saved && <RedirectNote url={redirectUrl} />}
    </ScreenFrame>
  );
}

const unavailableText: Record<Unavailable, { title: string; body: string }> = {
  live: { title: 'Loading', body: '' },
  not_open: {
    title: 'This survey is not open',
    body: 'The survey behind this link has not started yet, or it is being changed. Please try the link again later.',
  },
  closed: {
    title: 'This survey has closed',
    body: 'Thank you for your interest. The survey is no longer taking answers.',
  },
  over_quota: {
    title: 'This survey is full',
    body: 'The survey has all the answers it needs. Thank you for your interest.',
  },
  not_found: {
    title: 'We cannot find this survey',
    body: 'The link may be incomplete or mistyped. Please check it, or ask whoever sent it for a new one.',
  },
  session_lost: {
    title: 'We cannot find your answers',
    body: 'Your session on this device is no longer valid. Please open the link you were sent again.',
  },
};

export function UnavailableScreen({
  reason,
  studyName,
  redirectUrl,
  page,
}: {
  reason: Unavailable;
  studyName: string | null;
  redirectUrl: string | null;
  /** Before a session: the study's own words for a closed or full survey, in the link's language. */
  page?: { title: string; body: string } | null;
}) {
  useRedirect(redirectUrl, true);
  const t = useInterfaceText();
  // Inside a session (closed meanwhile) the respondent's language has these words.
  const text =
    page ??
    (reason === 'closed'
      ? { title: t('ui.closed_title'), body: t('ui.closed_body') }
      : unavailableText[reason]);
  return (
    <ScreenFrame title={text.title} eyebrow={studyName ?? undefined}>
      <Paragraphs text={text.body} />
      <RedirectNote url={redirectUrl} />
    </ScreenFrame>
  );
}
