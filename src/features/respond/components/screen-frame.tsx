import { useEffect, useRef, type ReactNode } from 'react';
import { markFirstScreen } from '../utils/first-screen-mark';

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

/** The big primary action at the bottom of a screen; sticky on phones so it stays in reach. */
export function NextBar({ children }: { children: ReactNode }) {
  return (
    <div className="sticky bottom-0 -mx-4 mt-6 border-t border-line bg-canvas/95 px-4 py-3 backdrop-blur sm:static sm:mx-0 sm:border-0 sm:bg-transparent sm:px-0">
      {children}
    </div>
  );
}
