// Browser figures through playwright-core on Debian chromium: what the first screen of a page
// downloads (JS and CSS, gzip), and how fast the app shell opens from the service worker offline.
import { gzipSync } from 'node:zlib'
import { chromium, type Browser } from 'playwright-core'

export const CHROMIUM = process.env.CHROME_PATH || '/usr/bin/chromium'
export const CHROMIUM_FLAGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync']

export const launch = () => chromium.launch({ executablePath: CHROMIUM, args: CHROMIUM_FLAGS })

// When the page's first heading is on screen: the first screen a person sees.
const MARK_FIRST_SCREEN = () => {
  const w = window as unknown as { __firstScreen?: number }
  new MutationObserver((_m, obs) => {
    if (document.querySelector('h1')) {
      w.__firstScreen = performance.now()
      obs.disconnect()
    }
  }).observe(document, { childList: true, subtree: true })
}

export interface FirstLoad { firstScreen: number, after: number, files: number, afterFiles: number }

/**
 * JS and CSS the first screen waited for (loaded before its heading appeared: a file still on
 * its way then cannot have been waited for), each file
 * gzipped here at the default level so the figure does not depend on how the server sends it;
 * `after` is what loaded later, until the network went quiet (sync, the service worker's page).
 */
export async function firstLoad(browser: Browser, base: string, path: string, cookie?: string): Promise<FirstLoad> {
  const context = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 2 })
  try {
    if (cookie) {
      const [name, value] = cookie.split('=') as [string, string]
      await context.addCookies([{ name, value, url: base }])
    }
    await context.addInitScript(MARK_FIRST_SCREEN)
    const page = await context.newPage()
    await page.goto(base + path, { waitUntil: 'networkidle' })
    await page.waitForFunction(() => (window as unknown as { __firstScreen?: number }).__firstScreen !== undefined)
    const { entries, at } = await page.evaluate(() => ({
      at: (window as unknown as { __firstScreen: number }).__firstScreen,
      entries: (performance.getEntriesByType('resource') as PerformanceResourceTiming[]).map(e => ({ name: e.name, end: e.responseEnd })),
    }))
    const assets = entries.filter(e => /\.(js|css)(\?|$)/.test(new URL(e.name).pathname) && e.name.startsWith(base))
    const seen = new Set<string>()
    const result = { firstScreen: 0, after: 0, files: 0, afterFiles: 0 }
    for (const e of assets) {
      if (seen.has(e.name)) continue
      seen.add(e.name)
      const body = Buffer.from(await (await fetch(e.name)).arrayBuffer())
      const size = gzipSync(body).length
      if (e.end <= at) {
        result.firstScreen += size
        result.files++
      }
      else {
        result.after += size
        result.afterFiles++
      }
    }
    return result
  }
  finally {
    await context.close()
  }
}

/** Open `/` signed in, let the service worker take over, cut the network and reload: ms to the first screen. */
export async function offlineShell(browser: Browser, base: string, cookie: string, tries = 5): Promise<number[]> {
  const context = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 2 })
  try {
    const [name, value] = cookie.split('=') as [string, string]
    await context.addCookies([{ name, value, url: base }])
    await context.addInitScript(MARK_FIRST_SCREEN)
    const page = await context.newPage()
    await page.goto(`${base}/`, { waitUntil: 'networkidle' })
    await page.evaluate(async () => {
      await navigator.serviceWorker.ready
    })
    await page.reload({ waitUntil: 'networkidle' })
    if (!(await page.evaluate(() => !!navigator.serviceWorker.controller))) throw new Error('the service worker did not take control')
    await context.setOffline(true)
    const times: number[] = []
    for (let i = 0; i < tries; i++) {
      await page.reload({ waitUntil: 'load' })
      await page.waitForFunction(() => (window as unknown as { __firstScreen?: number }).__firstScreen !== undefined)
      const heading = await page.locator('h1').first().textContent()
      if (!heading?.includes('Bench')) throw new Error(`offline reload showed "${heading}", not the Bench`)
      times.push(await page.evaluate(() => (window as unknown as { __firstScreen: number }).__firstScreen))
    }
    return times
  }
  finally {
    await context.close()
  }
}
