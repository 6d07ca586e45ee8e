// One flat config for the whole repository: TypeScript everywhere, Vue SFCs in the app.
import js from '@eslint/js'
import tseslint from 'typescript-eslint'
import vue from 'eslint-plugin-vue'
import globals from 'globals'

export default tseslint.config(
  { ignores: ['node_modules/**', 'dist/**', '.nuxt/**', '.output/**', 'storage/**', 'coverage/**', 'test-results/**', '**/.scratch/**', '.cache/**'] },
  js.configs.recommended,
  ...tseslint.configs.recommended,
  ...vue.configs['flat/recommended'],
  {
    files: ['**/*.vue'],
    languageOptions: { parserOptions: { parser: tseslint.parser, extraFileExtensions: ['.vue'] } },
  },
  {
    languageOptions: { globals: { ...globals.node, ...globals.browser } },
    rules: {
      // Nuxt and Nitro auto-import their helpers; the type checker catches real undefined names.
      'no-undef': 'off',
      '@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', caughtErrors: 'none' }],
      'vue/multi-word-component-names': 'off',
      'vue/max-attributes-per-line': 'off',
      'vue/singleline-html-element-content-newline': 'off',
      'vue/html-self-closing': 'off',
      'vue/first-attribute-linebreak': 'off',
      'vue/html-closing-bracket-newline': 'off',
      'vue/multiline-html-element-content-newline': 'off',
    },
  },
  {
    // Slow cross-check routes (shared/math/oracles.ts) are witnesses for tests, never a path of the product.
    files: ['**/*.ts', '**/*.vue', '**/*.mjs'],
    ignores: ['tests/**'],
    rules: { 'no-restricted-imports': ['error', { patterns: [{ regex: 'math/oracles(\\.ts)?$', message: 'shared/math/oracles.ts is only for tests.' }] }] },
  },
  {
    // Migrations are frozen in time and take Kysely<any>, as Kysely's own guide recommends.
    files: ['migrations/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
  {
    // API tests read JSON bodies whose shape the assertions themselves check.
    files: ['tests/**/*.ts'],
    rules: { '@typescript-eslint/no-explicit-any': 'off' },
  },
)
