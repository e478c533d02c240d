// ESLint for the whole repository: `npm run lint:code` (part of `npm run lint`, which `npm test` runs first).
// typescript-eslint's recommended rules everywhere; React's hook rules and TanStack Query's rules
// for the client. Rules are switched off here, each with its reason, never with inline disables.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import reactHooks from 'eslint-plugin-react-hooks';
import pluginQuery from '@tanstack/eslint-plugin-query';
import globals from 'globals';

export default tseslint.config(
  { ignores: ['dist/', 'node_modules/', '.data/', 'public/', 'coverage/'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { ecmaVersion: 2023, sourceType: 'module' },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      // `_`-prefixed names are deliberately unused (a handler's unused `req`, a skipped tuple slot).
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
    },
  },
  // The client: browser globals, hooks and query rules.
  {
    files: ['src/**/*.{ts,tsx}'],
    ignores: ['src/shared/**'],
    languageOptions: { globals: globals.browser },
    plugins: reactHooks.configs.flat.recommended.plugins,
    rules: {
      ...reactHooks.configs.flat.recommended.rules,
      // Two React Compiler rules flag patterns the client uses on purpose; changing them is a redesign of
      // those components, not a lint fix, and we do not run the compiler.
      // The "latest ref" (`ref.current = props.x` during render) keeps memoised callbacks stable for the
      // editor's table, canvas and gestures (useEffectEvent is the newer tool; move to it when those
      // hooks are reworked).
      'react-hooks/refs': 'off',
      // State copied from props or query data in an effect: forms that reset when the draft changes, the
      // bead type library's editable copy, the session that exists only while the editor is mounted.
      'react-hooks/set-state-in-effect': 'off',
      // Warns that TanStack Table's useReactTable cannot be memoised by the compiler, which we do not use.
      'react-hooks/incompatible-library': 'off',
      // The client runs in the browser. tsconfig.client.json has no Node types, but @types/papaparse
      // pulls them in, so the compiler alone would not notice Node globals here.
      'no-restricted-globals': ['error', 'process', 'Buffer', 'global', '__dirname', '__filename', 'require'],
    },
  },
  ...pluginQuery.configs['flat/recommended'].map((c) => ({ ...c, files: ['src/**/*.{ts,tsx}'] })),
  // Everything that runs in Node: the server, migrations, seeds, scripts, benchmarks, tests, configs.
  {
    files: ['server/**', 'migrations/**', 'seeds/**', 'scripts/**', 'bench/**', 'tests/**', '*.{js,mjs,cjs,ts}'],
    languageOptions: { globals: globals.node },
  },
  {
    files: ['tests/**'],
    rules: {
      // Tests read JSON answers whose shape is exactly what they check (supertest types them `any` too).
      '@typescript-eslint/no-explicit-any': 'off',
    },
  },
  {
    // These two regular expressions match control characters on purpose: they strip them from mail
    // headers and from link targets before the scheme check.
    files: ['server/notifications/notification-mail.ts', 'src/shared/threads-markdown.ts'],
    rules: { 'no-control-regex': 'off' },
  },
);
