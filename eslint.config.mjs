// ESLint flat config: the recommended JavaScript and typescript-eslint rules, the two React Hooks
// rules (rules-of-hooks, exhaustive-deps; the plugin's React Compiler checks are left out because
// the app does not build with the React Compiler), and eslint-config-prettier last so formatting
// is Prettier's alone. Import cycles are checked by
// dpdm in `npm run lint` (`lint:cycles` in package.json).
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import reactHooks from 'eslint-plugin-react-hooks';
import globals from 'globals';
import tseslint from 'typescript-eslint';

export default tseslint.config(
  { ignores: ['node_modules/', 'dist/', '.data/', '.expo/', 'test-results/', 'public/', 'bench/results/', 'expo-env.d.ts'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    rules: {
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
    },
  },
  {
    files: ['app/**/*.tsx', 'components/**/*.{ts,tsx}', 'hooks/**/*.ts'],
    plugins: { 'react-hooks': reactHooks },
    rules: { 'react-hooks/rules-of-hooks': 'error', 'react-hooks/exhaustive-deps': 'error' },
  },
  { files: ['**/*.js', '**/*.cjs'], rules: { '@typescript-eslint/no-require-imports': 'off' } },
  prettier,
);
