import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll } from 'vitest'
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core'

export const BASE = process.env.TW_TEST_URL ?? 'http://localhost:3000'
export const DEMO_PASSWORD = process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo'

export function launch(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROME_PATH || '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  })
}

export function phone(browser: Browser, options: { colorScheme?: 'dark' | 'light' } = {}): Promise<BrowserContext> {
  return browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 2, colorScheme: options.colorScheme ?? 'dark' })
}

export async function hydrated(page: Page) {
  await page.waitForFunction(() => {
    const w = window as unknown as { useNuxtApp?: () => { isHydrating?: boolean } }
    return !!w.useNuxtApp && w.useNuxtApp().isHydrating === false
  }, null, { timeout: 20_000 })
}

/** Sign in through the API (shares the cookie with the page). */
export async function apiLogin(page: Page, email: string, password = DEMO_PASSWORD) {
  const r = await page.request.post(`${BASE}/api/auth/login`, { data: { email, password } })
  if (!r.ok()) throw new Error(`login ${email}: ${r.status()}`)
}

/**
 * One browser for a test file: launched before its tests and closed after them. The value is
 * usable from inside the tests (it forwards to the browser once launched).
 */
export function browserForFile(opts: { artifacts?: boolean } = {}): Browser {
  let browser: Browser | undefined
  beforeAll(async () => {
    if (!process.env.TW_TEST_URL) throw new Error('TW_TEST_URL is not set: run through npm test (scripts/test.mjs).')
    browser = await launch()
    if (opts.artifacts) mkdirSync('tests/artifacts', { recursive: true })
  })
  afterAll(async () => {
    await browser?.close()
  })
  return new Proxy({} as Browser, {
    get(_target, key) {
      if (!browser) throw new Error('The browser is launched in beforeAll; use it inside a test.')
      const value = Reflect.get(browser, key)
      return typeof value === 'function' ? value.bind(browser) : value
    },
  })
}

/** A phone-sized page signed in as `email`, opened at `path` and hydrated. */
export async function pageAs(browser: Browser, email: string, path: string, options: { colorScheme?: 'dark' | 'light' } = {}): Promise<Page> {
  const page = await (await phone(browser, options)).newPage()
  await apiLogin(page, email)
  await page.goto(`${BASE}${path}`)
  await hydrated(page)
  return page
}

/**
 * First visit online: open `path`, wait for the service worker to take control (it precaches the
 * app), so a later visit with the network cut is served from the device.
 */
export async function openWithServiceWorker(page: Page, path: string) {
  await page.goto(`${BASE}${path}`)
  await hydrated(page)
  await page.evaluate(async () => {
    await navigator.serviceWorker.ready
  })
  await page.reload()
  await hydrated(page)
  return page.evaluate(() => !!navigator.serviceWorker.controller)
}
