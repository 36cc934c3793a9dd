// Every screen at 360 x 800 in both themes: no serious or critical axe findings, and bands and
// sync states always carry a word and a shape besides their colour.
import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import type { AxeResults, RunOptions } from 'axe-core'
import type { BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { STORAGE_KEYS } from '../../app/utils/storage-keys'
import { apiLogin, BASE, browserForFile, hydrated, phone } from './helpers/browser'
import { makeDemoRecords, pageRoutes, PAGES, resolveConflict, type Made } from './helpers/pages'

const browser = browserForFile()
// axe-core's own build, from node_modules (never fetched), injected once per page: the app
// moves between addresses without reloading, so it stays. Evaluated from the test rather than
// added as a <script>, which the app's content-security-policy rightly refuses.
const AXE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8')

async function axe(page: Page, options: RunOptions = {}): Promise<AxeResults> {
  if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(AXE)
  return page.evaluate(o => (window as unknown as { axe: { run: (c: Document, o: RunOptions) => Promise<AxeResults> } }).axe.run(document, o), { ...options, resultTypes: ['violations'] } as RunOptions)
}
let made: Made
const contexts = new Map<string, BrowserContext>()

beforeAll(async () => {
  made = await makeDemoRecords()
}, 60_000)
let conflictIds: string[] = []
afterAll(async () => {
  for (const c of contexts.values()) await c.close()
  // The other browser tests expect the demo shop in sync: decide what is open.
  for (const id of conflictIds) await resolveConflict(id)
})

/** One page per person, signed in once; later addresses open inside the app, as a person moves through it. */
const pages = new Map<string, Page>()
async function pageFor(as: string | null) {
  const key = String(as)
  let page = pages.get(key)
  if (!page) {
    const context = await phone(browser, { colorScheme: 'dark' })
    contexts.set(key, context)
    await context.addInitScript(([k]) => localStorage.setItem(k!, 'dark'), [STORAGE_KEYS.theme])
    page = await context.newPage()
    if (as) await apiLogin(page, as)
    pages.set(key, page)
  }
  return page
}

/** Opens an address and waits until its data is on screen (the first sync has finished). */
async function open(page: Page, path: string) {
  if (page.url().startsWith(BASE)) {
    await page.evaluate(p => (window as unknown as { useNuxtApp: () => { $router: { push: (p: string) => Promise<unknown> } } }).useNuxtApp().$router.push(p), path)
  }
  else {
    await page.goto(`${BASE}${path}`)
    await hydrated(page)
  }
  const chip = page.locator('[data-testid="sync-chip"]')
  if (await chip.count()) await page.locator('[data-testid="sync-chip"][data-state="synced"], [data-testid="sync-chip"][data-state="conflict"]').waitFor({ timeout: 20_000 })
  await page.waitForTimeout(400)
}

/** What the app's theme switch does (useTheme): the class on <html> swaps the colour variables. */
async function setTheme(page: Page, theme: 'dark' | 'light') {
  const changed = await page.evaluate((t) => {
    const root = document.documentElement
    const was = root.classList.contains(t)
    root.classList.toggle('dark', t === 'dark')
    root.classList.toggle('light', t === 'light')
    return !was
  }, theme)
  // Buttons ease their colours (transition-colors): read them once they have settled.
  if (changed) await page.waitForTimeout(400)
}

/** The open conflict's page, found where a person finds it: the sync screen's list. */
async function conflictPath(page: Page) {
  await open(page, '/sync')
  const link = page.locator('a[href^="/sync/conflicts/"]').first()
  await link.waitFor({ timeout: 20_000 })
  const hrefs = await page.locator('a[href^="/sync/conflicts/"]').evaluateAll(links => links.map(a => a.getAttribute('href')!))
  conflictIds = hrefs.map(h => h.split('/').at(-1)!)
  return hrefs[0]!
}

function describeViolations(results: AxeResults) {
  return results.violations
    .filter(v => v.impact === 'serious' || v.impact === 'critical')
    .map(v => `${v.id} (${v.impact}): ${v.help}\n${v.nodes.slice(0, 6).map(n => `    at ${n.target.join(' ')}: ${n.html.slice(0, 160)}\n      ${(n.failureSummary ?? '').replace(/\n/g, '\n      ')}`).join('\n')}`)
}

/** Every band and sync state on the page, with the words and shapes it carries. */
function signals(page: Page) {
  return page.evaluate(() => [...document.querySelectorAll('[data-band], [data-testid="band"], [data-testid="item-sync-state"], [data-testid="sync-chip"]')]
    .filter(el => (el as HTMLElement).offsetParent !== null)
    .map(el => ({
      kind: el.matches('[data-band], [data-testid="band"]') ? 'band' as const : 'sync' as const,
      text: (el.textContent ?? '').replace(/\s+/g, ' ').trim().toLowerCase(),
      shape: !!el.querySelector('svg'),
      html: el.outerHTML.slice(0, 160),
    })))
}

const BAND_WORDS = /\b(cold|in range|warm|over)\b/
const SYNC_WORDS = /on this device|sending|synced|needs a decision/
const seen = { band: 0, sync: 0 }

describe('accessibility at 360 x 800, dark and light', () => {
  it('has a row for every page under app/pages', () => {
    expect(Object.keys(PAGES).sort()).toEqual(pageRoutes())
  })

  for (const [route, row] of Object.entries(PAGES)) {
    it(`${route}: no serious or critical axe findings in either theme; bands and sync states carry words and shapes`, async () => {
      const page = await pageFor(row.as)
      const path = route === '/sync/conflicts/[id]' ? await conflictPath(page) : row.path(made)
      await open(page, path)
      expect(new URL(page.url()).pathname, 'stayed on its address').toBe(row.lands ?? path)
      const problems: string[] = []
      await setTheme(page, 'dark')
      for (const v of describeViolations(await axe(page))) problems.push(`[dark] ${v}`)
      // The light theme only swaps colour variables, so it needs only the colour rules.
      await setTheme(page, 'light')
      for (const v of describeViolations(await axe(page, { runOnly: ['color-contrast', 'link-in-text-block'] }))) problems.push(`[light] ${v}`)
      await setTheme(page, 'dark')
      for (const s of await signals(page)) {
        seen[s.kind]++
        const words = s.kind === 'band' ? BAND_WORDS : SYNC_WORDS
        if (!words.test(s.text) || !s.shape) problems.push(`a ${s.kind} without its word and shape: ${s.html}`)
      }
      expect(problems.join('\n\n')).toBe('')
    }, 60_000)
  }

  it('met both kinds of signal on the way (so the checks above checked something)', () => {
    expect(seen.band).toBeGreaterThan(0)
    expect(seen.sync).toBeGreaterThan(0)
  })
})
