// Lint that holds the layout (DEVELOPERS.md, "Layout rules"): who may import whom, plus the
// usual TypeScript and React hooks rules. `npm test` runs it first and fails on any error.

import { readdirSync } from 'node:fs';
import js from '@eslint/js';
import globals from 'globals';
import reactHooks from 'eslint-plugin-react-hooks';
import tseslint from 'typescript-eslint';

/** A no-restricted-imports rule built from groups of forbidden specifiers, each with its reason. */
const restrict = (...groups) => ['error', { patterns: groups.map(([group, message]) => ({ group, message })) }];

const TRADE_ENTRY = [['@shared/trade/*', '../trade/*', '../../trade/*'], 'Import trade rules from @shared/trade (shared/trade/index.ts is the only way in).'];
const NO_SERVER = [['@server/*', '**/server/**', '**/worker/**'], 'The client never imports server or worker code; share it through shared/.'];
const NO_CLIENT = [['@/*', '**/src/**'], 'Server and worker code never import the client (src/).'];
const features = readdirSync(new URL('./src/features', import.meta.url), { withFileTypes: true }).filter((d) => d.isDirectory()).map((d) => d.name);

export default tseslint.config(
  { ignores: ['dist/**', '.tmp/**', 'data/**', 'node_modules/**', 'bench/out/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node } },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      'no-restricted-imports': restrict(TRADE_ENTRY),
    },
  },
  {
    files: ['src/**/*.{ts,tsx}'],
    languageOptions: { globals: { ...globals.browser } },
    plugins: { 'react-hooks': reactHooks },
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      'no-restricted-imports': restrict(TRADE_ENTRY, NO_SERVER),
    },
  },
  // A feature's folder imports no other feature: pages in src/app/routes combine them.
  ...features.map((name) => ({
    files: [`src/features/${name}/**/*.{ts,tsx}`],
    rules: {
      'no-restricted-imports': restrict(
        TRADE_ENTRY,
        NO_SERVER,
        [['@/features/*', `!@/features/${name}`, `!@/features/${name}/**`], `src/features/${name} may not import another feature; combine them in a page under src/app/routes, or move the shared piece to src/lib or src/components.`],
      ),
    },
  })),
  // shared/ is pure code both sides use: it imports nothing of the client, the server or the worker.
  {
    files: ['shared/**/*.ts'],
    rules: { 'no-restricted-imports': restrict(TRADE_ENTRY, [['@/*', '@server/*', '**/src/**', '**/server/**', '**/worker/**', '**/scripts/**'], 'shared/ imports nothing from src/, server/, worker/ or scripts/.']) },
  },
  { files: ['shared/trade/**/*.ts'], rules: { 'no-restricted-imports': restrict([['@/*', '@server/*', '@shared/*', '../schemas/*', '**/src/**', '**/server/**'], 'shared/trade is self-contained: pure rules with their sources, no schemas, no I/O.']) } },
  // Routes validate, call a service and send: data access belongs to services.
  {
    files: ['server/routes/**/*.ts'],
    rules: { 'no-restricted-imports': restrict(TRADE_ENTRY, NO_CLIENT, [['@server/db/*', '../db/*'], 'A route calls a service; only services (and db/ itself) touch the database.']) },
  },
  { files: ['server/**/*.ts', 'worker/**/*.ts'], ignores: ['server/routes/**'], rules: { 'no-restricted-imports': restrict(TRADE_ENTRY, NO_CLIENT) } },
  // Tests may reach for any value they assert on.
  { files: ['**/*.test.{ts,tsx}', 'tests/**/*.ts'], rules: { '@typescript-eslint/no-explicit-any': 'off', '@typescript-eslint/no-non-null-assertion': 'off' } },
);
