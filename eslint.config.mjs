import './scripts/lib/node20-polyfills.mjs'
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['drizzle/**', '.data/**', 'tests/artifacts/**'] },
  // Tests read loosely typed JSON replies.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
)
