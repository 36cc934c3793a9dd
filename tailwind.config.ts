import type { Config } from 'tailwindcss'

// Colours are CSS variables (RGB triplets) so the light theme only swaps variables.
const token = (name: string) => `rgb(var(--tw-c-${name}) / <alpha-value>)`

export default {
  darkMode: 'class',
  content: ['./app/**/*.{vue,ts}', './shared/**/*.ts'],
  theme: {
    extend: {
      colors: {
        bg: token('bg'),
        surface: token('surface'),
        raised: token('raised'),
        ink: token('ink'),
        muted: token('muted'),
        line: token('line'),
        accent: token('accent'),
        'on-accent': token('on-accent'),
        band: {
          cold: token('cold'),
          ok: token('ok'),
          warm: token('warm'),
          over: token('over'),
        },
        caution: token('caution'),
        'on-caution': token('on-caution'),
        danger: token('danger'),
        'on-danger': token('on-danger'),
      },
      fontFamily: {
        sans: ['Inter', 'system-ui', 'sans-serif'],
      },
      minHeight: { touch: '44px' },
      minWidth: { touch: '44px' },
    },
  },
  plugins: [],
} satisfies Config
