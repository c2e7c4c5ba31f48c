// ESLint for Kvar Ledger: typescript-eslint's type-checked recommended rules over src and tests.
// Kept in .ci/ (the repository's top level is fixed); run through `npm run lint`.
import js from '@eslint/js';
import tseslint from 'typescript-eslint';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('..', import.meta.url));

export default tseslint.config(
  { ignores: ['dist/**', 'node_modules/**', 'test-artifacts/**', '**/*.mjs', '**/*.js'] },
  js.configs.recommended,
  ...tseslint.configs.recommendedTypeChecked,
  {
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: root },
    },
    rules: {
      // Wrong under noUncheckedIndexedAccess for indexed const tuples: the "unnecessary"
      // assertions it removes are the ones tsc needs (tried: the fix breaks the typecheck).
      '@typescript-eslint/no-unnecessary-type-assertion': 'off',
      // A function that implements an async interface (a CLI command's run, a storage method)
      // need not await anything itself.
      '@typescript-eslint/require-await': 'off',
      // Names starting with _ are kept on purpose (a destructured field left out).
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_' }],
      // Values read from files, cells and the clipboard are unknown by type and turned into
      // text on purpose, after the checks that keep objects out.
      '@typescript-eslint/no-base-to-string': 'off',
      // Event handlers may be async: each catches and reports its own failures.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { arguments: false } }],
    },
  },
  {
    files: ['tests/**/*.ts'],
    rules: {
      // Asymmetric matchers (expect.any, expect.objectContaining) are typed any by the test
      // runner; fakes hand methods around on purpose.
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-argument': 'off',
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/unbound-method': 'off',
    },
  },
);
