import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import { readdirSync } from 'node:fs';

// Client boundaries (DEVELOPERS.md): a feature imports no other feature, and the shared layers
// (components, lib, hooks, config, utils) import no feature; route modules in src/app compose
// features. The one exception: a feature's query-key factory (api/<name>-keys.ts) is public,
// because a mutation invalidates what it changed in other features' caches.
// The client gets from the server only what the API sends; types both sides use live in shared/.
const clientOnly = {
  group: ['@server/**', '@db/**', '**/server/**', '**/db/**'],
  message: 'The client imports nothing from server/ or db/; share types through shared/schemas.',
};
const features = readdirSync(`${import.meta.dirname}/src/features`, { withFileTypes: true })
  .filter((d) => d.isDirectory())
  .map((d) => d.name);
const featureBoundaries = features.map((feature) => ({
  files: [`src/features/${feature}/**/*.{ts,tsx}`],
  rules: {
    'no-restricted-imports': [
      'error',
      {
        patterns: [
          {
            regex: `^@/features/(?!${feature}/)(?![^/]+/api/[^/]+-keys$)`,
            message:
              'Features do not import other features; compose them in a route module (src/app).',
          },
          {
            // Inside a feature, relative imports stay one level up (api, components, hooks, utils).
            regex: '^(\\.\\./){2,}',
            message: 'Import shared code through @/…; relative imports stay inside the feature.',
          },
          {
            group: ['**/app/**', '@/app/**'],
            message: 'Features do not import the app shell or route modules.',
          },
          clientOnly,
        ],
      },
    ],
  },
}));

/** What the product's layers never import: the scripts, tests and journeys built around it. */
const productOnly = {
  group: ['**/scripts/**', '**/tests/**', '**/e2e/**'],
  message: 'The product imports nothing from scripts/, tests/ or e2e/.',
};

export default tseslint.config(
  {
    ignores: [
      'dist',
      'node_modules',
      '.data',
      'db/migrations',
      'test-results',
      'playwright-report',
    ],
  },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser, ...globals.node } },
    rules: {
      // Unused locals, parameters and imports in TypeScript are the compiler's check
      // (tsconfig.json: noUnusedLocals, noUnusedParameters; `npm run typecheck`, part of npm
      // test): ESLint's copy of it took half of lint's CPU. It still checks the .js files.
      '@typescript-eslint/no-unused-vars': 'off',
      'no-restricted-syntax': [
        'error',
        {
          selector: "MemberExpression[object.name='process'][property.name='env']",
          message: 'Read configuration through server/env.ts.',
        },
      ],
    },
  },
  {
    // React's rules where React is, the client and its tests (API tests' use* set-up helpers,
    // such as useTestApp, register vitest hooks at a file's top level, where they belong).
    files: ['src/**/*.{ts,tsx}', 'tests/src/**/*.{ts,tsx}'],
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'warn',
    },
  },
  {
    // The app shell, route modules and entry points compose features but stay client code.
    files: ['src/app/**/*.{ts,tsx}', 'src/*.{ts,tsx}'],
    rules: { 'no-restricted-imports': ['error', { patterns: [clientOnly] }] },
  },
  ...featureBoundaries,
  {
    files: ['src/{components,lib,hooks,config,utils}/**/*.{ts,tsx}'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            {
              group: ['@/features/**', '**/features/**', '@/app/**', '**/app/**'],
              message: 'Shared layers import no feature and no route module.',
            },
            clientOnly,
          ],
        },
      ],
    },
  },
  {
    // The data layer sits below the server: it never imports from it (the demo seed, which
    // goes through the server's services, lives in server/seed).
    files: ['db/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            { group: ['**/server/**', '@server/**'], message: 'db/ imports nothing from server/.' },
            productOnly,
          ],
        },
      ],
    },
  },
  {
    // Test and benchmark support (such as the study factory in scripts/lib) stays out of the product.
    files: ['server/**/*.ts', 'shared/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [productOnly] }] },
  },
  {
    // Config loaders, the seed's entry point, scripts and tests may read the environment directly.
    files: [
      'server/env.ts',
      'server/seed.ts',
      'scripts/**',
      'tests/**',
      'e2e/**',
      '*.config.ts',
      'db/**',
    ],
    rules: { 'no-restricted-syntax': 'off' },
  },
);
