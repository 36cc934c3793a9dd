import './scripts/lib/node20-polyfills.mjs'
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['drizzle/**', '.data/**', 'tests/artifacts/**', 'scripts/bench/bare/.nuxt/**', 'scripts/bench/bare/.output/**'] },
  // Tests read loosely typed JSON replies.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
)
