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
