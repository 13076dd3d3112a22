/**
 * The seeded demo study, as the journeys that read or change it (its runs, erasures, design
 * versions) use it.
 */
import fs from 'node:fs';
import { test } from '@playwright/test';
import { e2eSeedMark } from '../../playwright.config';

/**
 * Those journeys take this lock, so two of them never run at once: an erasure is refused while
 * a run of the study is being estimated and marks the runs that used the respondent, and a
 * redesign makes the study live again on a new version. Every other journey makes its own study.
 */
export const demoStudyLock = { lock: 'seeded-demo-study' };

/**
 * Sets the journey's own time limit, then waits until the demo seed, which finishes beside the
 * first journeys (scripts/e2e-server.sh), has stored its respondents. The wait does not count
 * against that limit.
 */
export async function demoStudySeeded(journeyTimeoutMs: number): Promise<void> {
  test.setTimeout(journeyTimeoutMs);
  const started = Date.now();
  const deadline = started + 240_000;
  while (!fs.existsSync(`${e2eSeedMark}.done`)) {
    if (fs.existsSync(`${e2eSeedMark}.failed`))
      throw new Error('the demo seed failed: see the web server output');
    if (Date.now() > deadline) throw new Error('the demo seed did not finish within 240 s');
    await new Promise((r) => setTimeout(r, 250));
  }
  test.setTimeout(test.info().timeout + (Date.now() - started));
}
