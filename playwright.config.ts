/**
 * End-to-end journeys in Debian's Chromium (/usr/bin/chromium; never a downloaded browser)
 * against the built app, started with its own database and the fake mail server.
 *
 * The journeys wait mostly on the browser, the server and the job workers, not on a core of
 * their own, so two run at once (E2E_WORKERS overrides). Each one creates what it changes (its
 * own study, team or accounts), except the journeys that read and change the seeded demo
 * study: they hold the lock in e2e/support/demo-study.ts, so they never overlap one another.
 */
import path from 'node:path';
import { defineConfig, devices } from '@playwright/test';

const port = Number(process.env.E2E_PORT ?? 5190);
export const e2eBaseUrl = `http://127.0.0.1:${port}`;
/** scripts/e2e-server.sh leaves `<this>.done` (or `.failed`) when the demo seed has finished. */
export const e2eSeedMark = path.resolve(import.meta.dirname, '.data', `e2e-seed-${port}`);

export default defineConfig({
  testDir: 'e2e',
  timeout: 120_000,
  expect: { timeout: 15_000 },
  fullyParallel: true,
  workers: Number(process.env.E2E_WORKERS ?? 2),
  retries: 0,
  reporter: [['list']],
  outputDir: 'test-results',
  use: {
    baseURL: e2eBaseUrl,
    // A failed journey keeps its trace (every action, console message and request) and a
    // screenshot of where it failed. The trace's DOM snapshot at every step and its film strip
    // are left out: recording them cost CPU on every journey, passed or failed (the 18
    // journeys on two cores: 65 s of CPU with the snapshots, 51 s without, 48 s with no trace
    // at all; 2026-12-04, load 7-8).
    trace: { mode: 'retain-on-failure', screenshots: false, snapshots: false },
    screenshot: 'only-on-failure',
    launchOptions: {
      executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
      args: [
        '--no-sandbox',
        '--disable-gpu',
        '--disable-quic',
        '--no-first-run',
        '--disable-background-networking',
        '--disable-component-update',
        '--disable-sync',
        // Pages of one context reuse renderer processes instead of starting one for nearly
        // every navigation (Chromium never shares a renderer between contexts, so journeys
        // stay as isolated). The 18 journeys on two cores: 104 renderer processes and 91 s of
        // the browser's CPU without it, 58 and 82 s with it (sampled from /proc, 2026-12-04).
        '--renderer-process-limit=2',
      ],
    },
  },
  projects: [{ name: 'desktop', use: { ...devices['Desktop Chrome'], channel: undefined } }],
  webServer: {
    command: `bash scripts/e2e-server.sh ${port}`,
    url: `${e2eBaseUrl}/api/health`,
    timeout: 240_000,
    env: { E2E_SEED_MARK: e2eSeedMark },
    reuseExistingServer: false,
    stdout: 'pipe',
    stderr: 'pipe',
  },
});
