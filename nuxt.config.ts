// The app is a client-rendered shell (ssr: false): user data lives in IndexedDB on the
// device, so there is nothing worth rendering on the server, and the prerendered shell is
// what the service worker serves when there is no signal.
export default defineNuxtConfig({
  compatibilityDate: '2026-11-01',
  ssr: false,
  devtools: { enabled: false },
  telemetry: false,
  modules: ['@pinia/nuxt', '@nuxtjs/tailwindcss', 'nuxt-auth-utils', '@vite-pwa/nuxt', '@nuxt/eslint'],
  css: [
    '@fontsource/inter/400.css',
    '@fontsource/inter/500.css',
    '@fontsource/inter/600.css',
    '@fontsource/inter/700.css',
    '~/assets/css/main.css',
  ],
  app: {
    head: {
      htmlAttrs: { lang: 'en', class: 'dark' },
      title: 'Tubewright',
      meta: [
        { name: 'viewport', content: 'width=device-width, initial-scale=1, viewport-fit=cover' },
        { name: 'description', content: 'Bench companion for tube amplifier techs, shops and players.' },
        { name: 'theme-color', content: '#14161a' },
      ],
      link: [{ rel: 'icon', href: '/favicon.svg', type: 'image/svg+xml' }],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    smtpHost: '127.0.0.1',
    smtpPort: 2525,
    mailFrom: 'Tubewright <no-reply@tubewright.example>',
    mailDir: '',
    publicOrigin: 'http://localhost:3000',
    session: {
      name: 'tubewright-session',
      maxAge: 60 * 60 * 24 * 30,
      cookie: { httpOnly: true, sameSite: 'lax', secure: process.env.NODE_ENV === 'production' && process.env.TW_INSECURE_COOKIE !== '1' },
    },
  },
  routeRules: {
    '/': { prerender: true },
  },
  nitro: {
    prerender: { routes: ['/'] },
  },
  tailwindcss: { cssPath: false, viewer: false },
  pwa: {
    registerType: 'prompt',
    manifest: false,
    workbox: { navigateFallback: null, globPatterns: [] },
    devOptions: { enabled: false },
    disable: true,
  },
  typescript: { strict: true },
  eslint: { config: { stylistic: false } },
})
