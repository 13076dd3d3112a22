import type { ReactNode } from 'react';
import { Brand } from './brand';

/** Centered card for sign-in, sign-up, password and invitation pages. */
export function AuthLayout({
  title,
  children,
  footer,
}: {
  title: string;
  children: ReactNode;
  footer?: ReactNode;
}) {
  return (
    <div className="flex min-h-dvh flex-col items-center justify-center px-4 py-10">
      <div className="mb-6">
        <Brand />
      </div>
      <main className="w-full max-w-sm rounded-xl border border-line bg-white p-6 shadow-sm">
        <h1 className="mb-5 text-xl font-semibold text-ink">{title}</h1>
        {children}
      </main>
      {footer && <div className="mt-4 text-sm text-ink-soft">{footer}</div>}
    </div>
  );
}
