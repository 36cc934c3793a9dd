import { defineConfig, minimal2023Preset } from '@vite-pwa/assets-generator/config'

// App icons are generated from our own SVG at build time (nothing fetched).
export default defineConfig({
  headLinkOptions: { preset: '2023' },
  preset: {
    ...minimal2023Preset,
    maskable: { ...minimal2023Preset.maskable, resizeOptions: { background: '#14161a' } },
    apple: { ...minimal2023Preset.apple, resizeOptions: { background: '#14161a' } },
  },
  images: ['public/favicon.svg'],
})
