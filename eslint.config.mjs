import './scripts/lib/node20-polyfills.mjs'
import withNuxt from './.nuxt/eslint.config.mjs'

export default withNuxt(
  { ignores: ['drizzle/**', '.data/**', 'tests/artifacts/**', 'scripts/bench/bare/.nuxt/**', 'scripts/bench/bare/.output/**'] },
  // Tests read loosely typed JSON replies.
  { files: ['tests/**'], rules: { '@typescript-eslint/no-explicit-any': 'off' } },
  // The bench's bare reference app names its one page the Nuxt way.
  { files: ['scripts/bench/bare/app/pages/**'], rules: { 'vue/multi-word-component-names': 'off' } },
)
