// The repository's one formatter: ESLint Stylistic on top of the lint config (eslint.config.mjs),
// so formatting and linting share one parser setup for .ts and .vue. Apply with `npm run format`;
// `npm run format:check` (run by `npm test`) only reports. Kept apart from the lint config so
// that `npx eslint .` reports defects only, and formatting is fixed by one command.
import stylistic from '@stylistic/eslint-plugin'
import lint from './eslint.config.mjs'

export default [
  ...lint,
  stylistic.configs.customize({
    indent: 2,
    quotes: 'single',
    semi: false,
    jsx: false,
    braceStyle: 'stroustrup',
    commaDangle: 'always-multiline',
    arrowParens: false,
    quoteProps: 'consistent-as-needed',
  }),
  {
    rules: {
      // Long one-line queries and messages are common here; the formatter does not wrap them.
      '@stylistic/max-len': 'off',
      '@stylistic/max-statements-per-line': 'off',
    },
  },
]
