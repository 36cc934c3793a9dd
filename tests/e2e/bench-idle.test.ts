import { mkdirSync } from 'node:fs'
import { describe, expect, it } from 'vitest'
import { browserForFile } from './helpers/browser'
import type { Page } from 'playwright-core'

const BASE = (process.env.TW_TEST_URL ?? '').replace(/\/$/, '')
const PASSWORD = process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo'
const browser = browserForFile()

async function signedInPage(theme: 'dark' | 'light'): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 360, height: 800 }, deviceScaleFactor: 2 })
  const page = await context.newPage()
  const r = await page.request.post(`${BASE}/api/auth/login`, { data: { email: 'tech@larkspur.example', password: PASSWORD } })
  expect(r.status()).toBe(200)
  await page.goto(`${BASE}/bench/idle-dissipation?theme=${theme}`)
  await page.waitForFunction(() => (window as unknown as { useNuxtApp?: () => { isHydrating: boolean } }).useNuxtApp?.()?.isHydrating === false)
  return page
}

async function fillFixedPair(page: Page) {
  await page.selectOption('#idle-tube', '6v6gta')
  await page.getByRole('radio', { name: 'Fixed bias' }).click()
  await page.fill('#idle-plate-volts', '285')
  await page.getByRole('radio', { name: /^Current read directly/ }).click()
  await page.fill('#idle-amps', '35 mA')
}

describe('Idle dissipation in a phone-sized browser', () => {
  for (const theme of ['dark', 'light'] as const) {
    it(`shows the band word and the plot for a fixed-bias 6V6 pair (${theme})`, async () => {
      const page = await signedInPage(theme)
      await fillFixedPair(page)
      // Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V, 35 mA per tube -> 9.98 W, 71.3 % of 14 W
      await expect.poll(() => page.textContent('[data-testid="band"]')).toContain('warm')
      expect(await page.textContent('[data-testid="watts"]')).toBe('9.98 W')
      expect(await page.textContent('[data-testid="percent"]')).toBe('71.3 %')
      const plot = page.locator('svg[data-testid="idle-plot"]')
      expect(await plot.getAttribute('aria-label')).toContain('285 V, 35.0 mA')
      const box = await plot.boundingBox()
      expect(box!.width).toBeGreaterThan(250)
      expect(box!.width).toBeLessThanOrEqual(360)
      // Nothing sideways: the page fits a 360 px phone.
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360)
      mkdirSync('tests/artifacts', { recursive: true })
      await page.screenshot({ path: `tests/artifacts/bench-idle-${theme}.png`, fullPage: true })
      await page.context().close()
    })
  }

  it('keeps the inputs after a reload, on the device', async () => {
    const page = await signedInPage('dark')
    await fillFixedPair(page)
    await page.reload()
    await page.waitForFunction(() => (window as unknown as { useNuxtApp?: () => { isHydrating: boolean } }).useNuxtApp?.()?.isHydrating === false)
    expect(await page.inputValue('#idle-amps')).toBe('35 mA')
    await expect.poll(() => page.textContent('[data-testid="band"]')).toContain('warm')
    await page.context().close()
  })

  it('opens every tool from the Bench list at its own address, and an unknown tool is the app\'s 404 page', async () => {
    const page = await signedInPage('light')
    await page.goto(`${BASE}/`)
    await page.locator('a[href="/bench/cap-drain"]').click()
    await page.waitForURL(/\/bench\/cap-drain$/)
    await expect.poll(() => page.textContent('h1')).toContain('Cap drain')
    expect(await page.title()).toBe('Cap drain · Tubewright')
    // A "what to do next" link to another tool opens that tool on the same page.
    await page.goto(`${BASE}/bench/cathode-resistor`)
    await page.locator('a[href="/bench/idle-dissipation"]').first().click()
    await page.locator('#idle-tube').waitFor()
    expect(await page.textContent('h1')).toContain('Idle dissipation')

    const shown = async (path: string) => {
      const r = await page.goto(`${BASE}${path}`)
      await page.waitForFunction(() => document.body.innerText.includes('404'))
      return { status: r?.status(), text: (await page.textContent('body'))!.replace(path, '<path>') }
    }
    const unknownPage = await shown('/no-such-page')
    const unknownTool = await shown('/bench/no-such-tool')
    expect(unknownTool.text).toContain('404')
    expect(unknownTool.text).not.toContain('Inputs')
    expect(unknownTool.status).toBe(unknownPage.status)
    await page.context().close()
  })
})
