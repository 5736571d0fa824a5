// ESLint for the whole project (flat config), run by `npm run lint` and as a step of `npm test`
// (scripts/run-tests.ts), which fails on any error or warning.
// typescript-eslint's recommended rules plus its promise checks (type-aware), the React hooks
// rules (7.x includes the React Compiler's checks) and the Next.js plugin's core-web-vitals set.
import js from '@eslint/js'
import nextPlugin from '@next/eslint-plugin-next'
import { defineConfig, globalIgnores } from 'eslint/config'
import reactHooks from 'eslint-plugin-react-hooks'
import tseslint from 'typescript-eslint'

export default defineConfig(
  // What .gitignore keeps out of the repository (ESLint does not read .gitignore; knip does).
  globalIgnores(['.next/', '.data/', 'out/', 'test-results/', 'tmp/', 'next-env.d.ts']),
  js.configs.recommended,
  tseslint.configs.recommended,
  {
    files: ['**/*.{ts,tsx,mjs}'],
    plugins: { '@next/next': nextPlugin },
    rules: nextPlugin.configs['core-web-vitals'].rules,
  },
  {
    // React lives in app/ and components/ only; geometry/, lib/, models/ and scripts/ have none
    // (style.md), and there a local function named `use` is not React's `use`.
    files: ['app/**/*.{ts,tsx}', 'components/**/*.{ts,tsx}', '**/*.tsx'],
    plugins: { 'react-hooks': reactHooks },
    rules: reactHooks.configs.flat.recommended.rules,
  },
  {
    rules: {
      // TypeScript itself reports undefined names and knows the DOM and Node globals; ESLint's
      // copy of the rule does not, and would flag every `window` and `process`.
      'no-undef': 'off',
      // `_name` marks a parameter or element kept for its position (a callback's signature, a
      // tuple's slot); anything else unused is an error.
      '@typescript-eslint/no-unused-vars': [
        'error',
        { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrorsIgnorePattern: '^_', ignoreRestSiblings: true },
      ],
    },
  },
  {
    // A forgotten `await` in a service or script leaves a transaction or a process half done:
    // these three need the types, so they run on the TypeScript files only.
    files: ['**/*.{ts,tsx}'],
    languageOptions: { parserOptions: { projectService: true, tsconfigRootDir: import.meta.dirname } },
    rules: {
      '@typescript-eslint/no-floating-promises': 'error',
      '@typescript-eslint/await-thenable': 'error',
      // React ignores what an event handler returns, so `onClick={async () => …}` is how a
      // handler awaits; our async handlers catch their own errors and show them. Other places
      // where a promise goes in for a void callback (a timer, an emitter) stay errors.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { attributes: false } }],
    },
  },
)
