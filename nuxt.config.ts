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
      // Static so the prerendered shell carries them before any script runs (install, offline).
      link: [
        { rel: 'icon', href: '/favicon.svg', type: 'image/svg+xml' },
        { rel: 'apple-touch-icon', href: '/apple-touch-icon-180x180.png' },
        { rel: 'manifest', href: '/manifest.webmanifest' },
      ],
    },
  },
  runtimeConfig: {
    databaseUrl: '',
    smtpHost: '127.0.0.1',
    smtpPort: 2525,
    mailFrom: 'Tubewright <no-reply@tubewright.example>',
    mailDir: '',
    publicOrigin: 'http://localhost:3000',
    // Photos and other content-addressed files (NUXT_BLOB_DIR).
    blobDir: '.data/blobs',
    // Where photos live (NUXT_BLOB_DRIVER): 'local' (the folder above) or 's3', an S3-compatible
    // bucket (NUXT_S3_BUCKET, _REGION, _ENDPOINT, _ACCESS_KEY_ID, _SECRET_ACCESS_KEY, _FORCE_PATH_STYLE, _PREFIX).
    blobDriver: 'local',
    s3Bucket: '',
    s3Region: 'us-east-1',
    s3Endpoint: '',
    s3AccessKeyId: '',
    s3SecretAccessKey: '',
    s3ForcePathStyle: false,
    s3Prefix: '',
    // The payment provider (NUXT_PAYMENT_*): a local fake in development and tests.
    paymentApiHost: '127.0.0.1',
    paymentApiPort: 0,
    paymentApiProtocol: 'http',
    paymentSecretKey: '',
    paymentWebhookSecret: '',
    // Lets POST /api/rigs/reminders/run trigger the reminder task (NUXT_RIG_REMINDER_SECRET; empty: off).
    rigReminderSecret: '',
    // The session cookie's Secure flag (NUXT_COOKIE_SECURE): true / false, or empty to follow the
    // public origin's scheme (server/utils/cookie-flags.ts). Sessions also live in the `sessions` table.
    cookieSecure: '',
    session: {
      name: 'tubewright-session',
      maxAge: 60 * 60 * 24 * 30,
      // Cookie only: no session read from a request header.
      sessionHeader: false,
      // Lax, not Strict: a pay or invitation link opened from an e-mail arrives as a top-level navigation.
      cookie: { httpOnly: true, sameSite: 'lax' },
    },
  },
  routeRules: {
    // Cache lifetimes (kept apart from any other headers): hashed build files never change, so
    // they are immutable for a year; the shell, the service worker and the manifest are checked
    // on every load so an update is seen at once.
    '/_nuxt/**': { headers: { 'cache-control': 'public, max-age=31536000, immutable' } },
    '/': { prerender: true, headers: { 'cache-control': 'no-cache' } },
    '/index.html': { headers: { 'cache-control': 'no-cache' } },
    '/sw.js': { headers: { 'cache-control': 'no-cache' } },
    '/manifest.webmanifest': { headers: { 'cache-control': 'no-cache' } },
  },
  nitro: {
    prerender: { routes: ['/'] },
    // Every file in public/ and the build is stored beside its .br and .gz; the server sends the
    // one the browser accepts. Cache lifetimes are in routeRules above.
    compressPublicAssets: { gzip: true, brotli: true },
    // Retube reminders (server/tasks/rigs/reminders.ts), checked every hour; mail the mail
    // server refused (server/tasks/mail/retry.ts), every minute.
    experimental: { tasks: true },
    scheduledTasks: { '0 * * * *': ['rigs:reminders'], '* * * * *': ['mail:retry'] },
  },
  tailwindcss: { cssPath: false, viewer: false },
  pwa: {
    // Never skip waiting on our own: AppUpdatePrompt asks before the new version takes over.
    registerType: 'prompt',
    manifest: {
      id: '/',
      name: 'Tubewright',
      short_name: 'Tubewright',
      description: 'Bench companion for tube amplifier techs, shops and players. Works with no signal.',
      lang: 'en',
      start_url: '/',
      scope: '/',
      display: 'standalone',
      orientation: 'portrait',
      theme_color: '#14161a',
      background_color: '#14161a',
    },
    // Icons come from public/favicon.svg via pwa-assets.config.ts, generated during the build (offline).
    pwaAssets: { config: true, overrideManifestIcons: true },
    workbox: {
      globPatterns: ['**/*.{js,css,html,svg,png,ico,webp,woff2,woff}'],
      navigateFallback: '/',
      navigateFallbackDenylist: [/^\/api\//],
      cleanupOutdatedCaches: true,
    },
    experimental: { enableWorkboxPayloadQueryParams: true },
    client: { installPrompt: false, periodicSyncForUpdates: 60 * 60 },
    devOptions: { enabled: false },
  },
  hooks: {
    // No <link rel="prefetch"> for every chunk in the shell: on a slow link they compete with the
    // first screen, and the service worker fetches them all once the page has loaded anyway.
    'build:manifest': (manifest) => {
      for (const chunk of Object.values(manifest)) chunk.prefetch = false
    },
  },
  experimental: {
    // Links load their page's code when touched or focused, not whenever they scroll into view:
    // on a slow phone that work competes with the first screen (the service worker has it all anyway).
    defaults: { nuxtLink: { prefetchOn: { visibility: false, interaction: true } } },
  },
  vite: {
    // No <link rel="modulepreload"> for every chunk a lazy page or component imports: a tool page
    // pulled in some forty, and inserting them cost a slow phone's main thread more than the
    // round trips they save (Lighthouse: the idle-dissipation tool's first paint and largest paint
    // came about a second sooner without them). CSS of lazy chunks is still loaded with them.
    build: { modulePreload: false },
  },
  typescript: { strict: true },
  eslint: { config: { stylistic: false } },
})
