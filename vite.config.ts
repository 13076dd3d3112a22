import { defineConfig } from 'vitest/config';
import type { Plugin } from 'vite';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';
import { fileURLToPath } from 'node:url';
import { EnvironmentSequencer } from './tests/environment-sequencer';

const r = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const apiPort = Number(process.env.API_PORT ?? 5180);

/**
 * The respondent page loads a tiny first script (src/respond-boot.ts, its own entry) with
 * `async`, so the session request leaves as soon as that script arrives, while React is still
 * downloading. Vite would merge a second script tag into the page's one entry, so the built
 * boot chunk is added to respond.html here.
 */
function respondBootScript(): Plugin {
  return {
    name: 'choicewright:respond-boot',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(html, ctx) {
        if (!ctx.filename.endsWith('respond.html') || !ctx.bundle) return html;
        const boot = Object.values(ctx.bundle).find(
          (c) => c.type === 'chunk' && c.isEntry && c.facadeModuleId?.endsWith('respond-boot.ts'),
        );
        if (!boot) return html;
        return {
          html,
          tags: [
            {
              tag: 'script',
              attrs: { type: 'module', async: true, crossorigin: true, src: `/${boot.fileName}` },
              injectTo: 'head-prepend',
            },
          ],
        };
      },
    },
  };
}

export default defineConfig({
  plugins: [react(), tailwindcss(), respondBootScript()],
  resolve: {
    alias: {
      '@': r('./src'),
      '@shared': r('./shared'),
      '@server': r('./server'),
      '@db': r('./db'),
    },
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': `http://127.0.0.1:${apiPort}`, '/files': `http://127.0.0.1:${apiPort}` },
  },
  build: {
    outDir: 'dist/client',
    sourcemap: true,
    // Two pages: the researcher app, and the lean respondent app served for /s/:publicId.
    rollupOptions: {
      input: {
        main: r('./index.html'),
        respond: r('./respond.html'),
        respondBoot: r('./src/respond-boot.ts'),
      },
      // Few, parallel requests for the respondent page (browsers open six connections per
      // host): the boot script's own small chunk, the respondent screens, and React.
      output: {
        codeSplitting: {
          groups: [
            {
              name: 'respond-start',
              test: /src\/(lib\/api-client|features\/respond\/(api\/start-session|utils\/(respondent-storage|public-id)))\.ts$/,
              priority: 2,
            },
            {
              name: 'respondent',
              test: /src\/(features\/respond|components\/(choice-task|ui)|lib)\//,
              priority: 1,
            },
          ],
        },
      },
    },
  },
  test: {
    // Playwright journeys live in e2e/ and run separately. Two projects: `unit` needs no
    // database (engine, shared code, client components); `api` runs against a real PostgreSQL
    // (a migrated template database per run, cloned per test file by tests/support/test-db.ts).
    testTimeout: 30_000,
    hookTimeout: 60_000,
    pool: 'forks',
    maxWorkers: 2,
    // Files of one environment in a row, so that a worker serves many files (isolate: false).
    sequence: { sequencer: EnvironmentSequencer },
    projects: [
      {
        extends: true,
        test: {
          name: 'unit',
          // Pure modules: one module cache per worker instead of one per file (import time).
          isolate: false,
          include: ['tests/{engine,shared,src}/**/*.test.{ts,tsx}'],
          globalSetup: ['tests/engine-build-setup.ts'],
        },
      },
      {
        extends: true,
        test: {
          name: 'api',
          isolate: false,
          include: ['tests/{server,db}/**/*.test.{ts,tsx}'],
          // The least Argon2id cost for the hundreds of throwaway accounts (server/env.ts).
          env: { PASSWORD_HASH_STRENGTH: 'test' },
          globalSetup: ['tests/engine-build-setup.ts', 'tests/global-setup.ts'],
        },
      },
    ],
  },
});
