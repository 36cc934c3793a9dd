// The main screens with a keyboard only: Tab reaches every control, each shows a visible focus
// ring while it has focus, and focus moves on past the last control (no trap).
import type { Page } from 'playwright-core'
import { describe, expect, it } from 'vitest'
import { BASE, browserForFile, hydrated, pageAs, phone } from './helpers/browser'
import { DEMO } from '../api/helpers/client'

const browser = browserForFile()

const MAIN_PAGES: { as: string | null, path: string }[] = [
  { as: null, path: '/signin' },
  { as: DEMO.tech, path: '/' },
  { as: DEMO.tech, path: '/bench/idle-dissipation' },
  { as: DEMO.tech, path: '/procedures' },
  { as: DEMO.desk, path: '/jobs' },
  { as: DEMO.desk, path: '/jobs/6f1c2a10-0000-4000-8003-000000000001' },
  { as: DEMO.tech, path: '/notebook' },
  { as: DEMO.dana, path: '/rigs' },
  { as: DEMO.owner, path: '/more' },
  { as: DEMO.owner, path: '/sync' },
]

/** Tags every control a keyboard should reach, with how it looks before it has focus. */
function tagControls(page: Page) {
  return page.evaluate(() => {
    const selector = 'a[href], button:not([disabled]), input:not([disabled]):not([type="hidden"]), select:not([disabled]), textarea:not([disabled]), summary, [tabindex]:not([tabindex="-1"])'
    const shown = (el: Element) => {
      const s = getComputedStyle(el)
      return el.getClientRects().length > 0 && s.visibility !== 'hidden' && !el.closest('[inert], [aria-hidden="true"]')
    }
    const radioGroups = new Set<string>()
    const controls = [...document.querySelectorAll<HTMLElement>(selector)].filter((el) => {
      if (!shown(el)) return false
      // A radio group is one Tab stop (arrow keys move inside it).
      if (el instanceof HTMLInputElement && el.type === 'radio') {
        if (radioGroups.has(el.name)) return false
        radioGroups.add(el.name)
      }
      return true
    })
    controls.forEach((el, i) => {
      const s = getComputedStyle(el)
      el.dataset.kb = String(i)
      el.dataset.kbRest = `${s.outlineStyle} ${s.outlineWidth}|${s.boxShadow}`
    })
    return controls.map(el => `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40)}"`)
  })
}

/** What has focus now, and whether it looks different from before it had focus. */
function focused(page: Page) {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null
    if (!el || el === document.body) return null
    // A radio group's Tab stop may be any of its radios.
    const tagged = el.dataset.kb !== undefined ? el : el instanceof HTMLInputElement && el.type === 'radio' ? document.querySelector<HTMLElement>(`input[type="radio"][name="${el.name}"][data-kb]`) : null
    const s = getComputedStyle(el)
    const now = `${s.outlineStyle} ${s.outlineWidth}|${s.boxShadow}`
    const outline = s.outlineStyle !== 'none' && Number.parseFloat(s.outlineWidth) > 0
    const shadow = s.boxShadow !== 'none' && now.split('|')[1] !== (tagged?.dataset.kbRest ?? '').split('|')[1]
    return { kb: tagged?.dataset.kb ?? null, ring: outline || shadow, what: `${el.tagName.toLowerCase()} "${(el.getAttribute('aria-label') ?? el.textContent ?? '').trim().slice(0, 40)}"` }
  })
}

async function openPage(as: string | null, path: string) {
  if (as) return pageAs(browser, as, path)
  const page = await (await phone(browser)).newPage()
  await page.goto(`${BASE}${path}`)
  await hydrated(page)
  return page
}

describe('keyboard only, at 360 x 800', () => {
  for (const { as, path } of MAIN_PAGES) {
    it(`${path}${as ? ` (${as.split('@')[0]})` : ''}: Tab reaches every control with a visible focus ring, and no trap`, async () => {
      const page = await openPage(as, path)
      try {
        await page.waitForTimeout(800)
        const controls = await tagControls(page)
        expect(controls.length).toBeGreaterThan(0)
        await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
        const reached = new Set<string>()
        const noRing: string[] = []
        let leftThePage = false
        // Round the page once: past the last control focus leaves the page, the next Tab comes back in at the top.
        for (let i = 0; i < 2 * controls.length + 10; i++) {
          await page.keyboard.press('Tab')
          const f = await focused(page)
          if (!f) {
            if (reached.size) leftThePage = true
            continue
          }
          if (leftThePage && f.kb !== null && reached.has(f.kb)) break
          if (f.kb !== null) reached.add(f.kb)
          if (!f.ring) noRing.push(f.what)
        }
        const missed = controls.filter((_, i) => !reached.has(String(i)))
        expect(missed, 'controls Tab never reached').toEqual([])
        expect([...new Set(noRing)], 'controls with no visible focus ring').toEqual([])
        expect(leftThePage, 'Tab moves on past the last control').toBe(true)
      }
      finally {
        await page.context().close()
      }
    }, 60_000)
  }
})
