// The reference for `npm run bench`: one bare page with the PWA module, built and served the same
// way as the app (client-rendered, prerendered shell, pre-compressed assets).
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  ssr: false,
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@vite-pwa/nuxt'],
  app: { head: { htmlAttrs: { lang: 'en' }, title: 'Bare page', meta: [{ name: 'description', content: 'A bare reference page.' }] } },
  routeRules: { '/': { prerender: true } },
  nitro: { prerender: { routes: ['/'] }, compressPublicAssets: { gzip: true, brotli: true } },
  pwa: {
    registerType: 'prompt',
    manifest: { name: 'Bare page', short_name: 'Bare', start_url: '/', display: 'standalone', theme_color: '#14161a', background_color: '#14161a' },
    workbox: { globPatterns: ['**/*.{js,css,html}'], navigateFallback: '/' },
    client: { installPrompt: false },
  },
})
