/**
 * Marks the moment the first respondent screen is on the page (a User Timing mark), once per
 * page load. The first-screen benchmark (scripts/bench-first-screen.ts) reads it; browsers'
 * own tools show it too.
 */
export const FIRST_SCREEN_MARK = 'cw:first-screen';

export function markFirstScreen(): void {
  if (typeof performance === 'undefined' || typeof performance.mark !== 'function') return;
  if (performance.getEntriesByName(FIRST_SCREEN_MARK).length === 0)
    performance.mark(FIRST_SCREEN_MARK);
}
