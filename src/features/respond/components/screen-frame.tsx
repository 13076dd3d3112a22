import { createContext, useContext, useEffect, useRef, type ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { markFirstScreen } from '../utils/first-screen-mark';
import { useInterfaceText } from '@/lib/interface-texts';

/** What Back does on the current screen, or null when there is no earlier screen to change. */
export const GoBackContext = createContext<(() => void) | null>(null);

/**
 * One screen of the questionnaire. The heading takes focus when the screen appears, so screen
 * readers announce the new screen and keyboard users start from the top.
 */
export function ScreenFrame({
  title,
  eyebrow,
  children,
  wide,
}: {
  title: string;
  eyebrow?: string;
  children: ReactNode;
  wide?: boolean;
}) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => {
    heading.current?.focus();
    markFirstScreen();
  }, []);
  return (
    <section className={wide ? 'mx-auto w-full max-w-5xl' : 'mx-auto w-full max-w-2xl'}>
      {eyebrow && <p className="mb-1 text-sm font-medium text-primary">{eyebrow}</p>}
      <h1
        ref={heading}
        tabIndex={-1}
        // Focus is moved here for screen readers; a focus ring on a heading would only confuse.
        style={{ outline: 'none' }}
        className="text-xl font-semibold leading-snug text-ink sm:text-2xl"
      >
        {title}
      </h1>
      <div className="mt-4">{children}</div>
    </section>
  );
}

/** Paragraphs from plain text: a blank line starts a new paragraph. */
export function Paragraphs({ text }: { text: string }) {
  return (
    <div className="space-y-3 text-base leading-relaxed text-ink-soft">
      {text
        .split(/\n\s*\n/)
        .filter((p) => p.trim())
        .map((p, i) => (
          <p key={i} className="whitespace-pre-line">
            {p}
          </p>
        ))}
    </div>
  );
}

/**
 * The big primary action at the bottom of a screen, sticky on phones so it stays in reach, with
 * Back before it when the respondent may change the previous answer.
 */
export function NextBar({ children }: { children: ReactNode }) {
  const goBack = useContext(GoBackContext);
  const t = useInterfaceText();
  return (
    <div className="sticky bottom-0 -mx-4 mt-6 flex items-center gap-3 border-t border-line bg-canvas/95 px-4 py-3 backdrop-blur sm:static sm:mx-0 sm:border-0 sm:bg-transparent sm:px-0">
      {goBack && (
        <Button type="button" variant="secondary" size="lg" onClick={goBack}>
          {t('ui.back')}
        </Button>
      )}
      <div className="min-w-0 flex-1">{children}</div>
    </div>
  );
}
