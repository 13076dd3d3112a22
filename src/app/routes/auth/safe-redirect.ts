/** Only same-site paths: a crafted ?redirectTo= must never send someone to another site. */
export function safeRedirect(to: string | null, fallback: string): string {
  return to && to.startsWith('/') && !to.startsWith('//') && !to.startsWith('/\\') ? to : fallback;
}

/** Keeps ?redirectTo= and ?email= when moving between sign-in and sign-up. */
export function withAuthParams(href: string, params: URLSearchParams): string {
  const keep = new URLSearchParams();
  for (const k of ['redirectTo', 'email']) {
    const v = params.get(k);
    if (v) keep.set(k, v);
  }
  const qs = keep.toString();
  return qs ? `${href}${href.includes('?') ? '&' : '?'}${qs}` : href;
}
