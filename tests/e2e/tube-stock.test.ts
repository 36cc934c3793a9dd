import { mkdirSync } from 'node:fs'
import { randomUUID } from 'node:crypto'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { APIRequestContext, Browser, Page } from 'playwright-core'
import { apiLogin, BASE, hydrated, launch, phone } from './helpers/browser'

let browser: Browser
beforeAll(async () => {
  if (!process.env.TW_TEST_URL) throw new Error('TW_TEST_URL is not set: run through npm test (scripts/test.mjs).')
  browser = await launch()
  mkdirSync('tests/artifacts', { recursive: true })
})
afterAll(async () => {
  await browser?.close()
})

async function as(email: string, path: string, colorScheme: 'dark' | 'light' = 'dark'): Promise<Page> {
  const page = await (await phone(browser, { colorScheme })).newPage()
  await apiLogin(page, email)
  // The app keeps its own theme (dark unless chosen); ?theme= picks it for the device.
  await page.goto(`${BASE}${path}${path.includes('?') ? '&' : '?'}theme=${colorScheme}`)
  await hydrated(page)
  return page
}

async function post(api: APIRequestContext, path: string, data: unknown) {
  const r = await api.post(`${BASE}${path}`, { data })
  if (!r.ok()) throw new Error(`${path}: ${r.status()} ${await r.text()}`)
  return r.json()
}

const fitsThePhone = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth)

describe('tube stock at 360 x 800', () => {
  for (const theme of ['dark', 'light'] as const) {
    it(`lists the demo lots and the quad in stock, and prints the quad's label with its QR code (${theme})`, async () => {
      const page = await as('tech@larkspur.example', '/tubes/stock', theme)
      await page.locator('[data-testid="set-S-1"]').waitFor({ timeout: 30_000 })
      expect(await page.textContent('[data-testid="set-S-1"]')).toContain('matched quad 6L6GC')
      expect(await page.locator('article[data-testid^="lot-"]').count()).toBeGreaterThanOrEqual(2)
      expect(await fitsThePhone(page)).toBeLessThanOrEqual(360)
      await page.screenshot({ path: `tests/artifacts/tube-stock-${theme}.png`, fullPage: true })

      await page.click('[data-testid="set-label-S-1"]')
      await page.locator('[data-testid="set-qr"]').waitFor({ timeout: 10_000 })
      const label = await page.textContent('[data-testid="set-label"]')
      expect(label).toContain('L1-01')
      expect(label).toContain('41.2 mA at 400 V plate')
      expect(await fitsThePhone(page)).toBeLessThanOrEqual(360)
      await page.screenshot({ path: `tests/artifacts/tube-stock-label-${theme}.png`, fullPage: true })
      await page.context().close()
    })
  }

  it('the desk reads stock but is offered no changes', async () => {
    const page = await as('desk@larkspur.example', '/tubes/stock')
    await page.locator('[data-testid="set-S-1"]').waitFor({ timeout: 30_000 })
    expect(await page.locator('[data-testid="lot-add"]').count()).toBe(0)
    await page.context().close()
  })

  it('fits a pair to a job with no signal; once back online the job lists it as a part', async () => {
    const desk = await as('desk@larkspur.example', '/jobs')
    const customer = await post(desk.request, '/api/customers', { name: 'Tess Marlowe' })
    const amp = await post(desk.request, '/api/amps', { customerId: customer.id, description: 'two-6L6 combo, fixed bias', serial: `TS-${randomUUID().slice(0, 6)}` })
    const job = await post(desk.request, '/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Retube' })
    await desk.context().close()

    const tech = await as('tech@larkspur.example', '/tubes/stock')
    const lot = await post(tech.request, '/api/stock/lots', { tubeType: '6l6gc', maker: 'E2E lot', costCents: 2000 })
    const setId = randomUUID()
    const label = `S-E${randomUUID().slice(0, 4)}`
    const tubeIds = []
    for (const [i, amps] of [0.040, 0.041].entries()) {
      tubeIds.push((await post(tech.request, '/api/stock/tubes', { lotId: lot.id, label: `E-0${i + 1}`, plateVolts: 400, gridVolts: -45, amps, testedOn: '2026-12-01', setId })).id)
    }
    // By hand: 41 / 40 − 1 = 0.025
    await post(tech.request, '/api/stock/sets', { id: setId, tubeType: '6l6gc', label, tubeIds, size: 2, spreadFraction: 0.041 / 0.040 - 1 })

    await tech.goto(`${BASE}/jobs/${job.id}`)
    await hydrated(tech)
    await tech.locator(`#fit-set option[value="${setId}"]`).waitFor({ state: 'attached', timeout: 30_000 })
    const html = await tech.content()
    expect(html.indexOf('Caution: high voltage inside')).toBeLessThan(html.indexOf('data-testid="fit-set-go"'))
    await tech.context().setOffline(true)
    await tech.selectOption('#fit-set', setId)
    await tech.fill('#fit-price', '64')
    await tech.click('[data-testid="fit-set-go"]')
    await expect.poll(() => tech.textContent('[data-testid="fitted-sets"]')).toContain('the part is added when it syncs')
    expect(await fitsThePhone(tech)).toBeLessThanOrEqual(360)
    await tech.screenshot({ path: 'tests/artifacts/tube-stock-fit-offline.png', fullPage: true })

    await tech.context().setOffline(false)
    await tech.evaluate(() => window.dispatchEvent(new Event('online')))
    await expect.poll(() => tech.textContent('body'), { timeout: 30_000 }).toContain(`Matched pair 6L6GC, set ${label}`)
    await expect.poll(() => tech.textContent('[data-testid="fitted-sets"]')).not.toContain('the part is added when it syncs')

    // Back to stock, with no signal: the confirmation says what happens; the part comes off once synced.
    await tech.context().setOffline(true)
    await tech.click(`[data-testid="return-${label}"]`)
    expect(await tech.textContent(`[data-testid="return-${label}-ask"]`)).toContain(`Set ${label} goes back into stock and its part comes off this job.`)
    await tech.click(`[data-testid="return-${label}-yes"]`)
    await expect.poll(() => tech.locator('[data-testid="fitted-sets"]').count()).toBe(0)
    await tech.context().setOffline(false)
    await tech.evaluate(() => window.dispatchEvent(new Event('online')))
    await expect.poll(() => tech.textContent('body'), { timeout: 30_000 }).not.toContain(`Matched pair 6L6GC, set ${label}`)

    // Deleting from stock, offline too: the set (its tubes stay), then the lot with its readings.
    await tech.goto(`${BASE}/tubes/stock?theme=dark`)
    await hydrated(tech)
    const card = tech.locator(`[data-testid="set-${label}"]`)
    await card.waitFor({ timeout: 30_000 })
    await tech.context().setOffline(true)
    await tech.click(`[data-testid="delete-set-${label}"]`)
    expect(await tech.textContent(`[data-testid="delete-set-${label}-ask"]`)).toContain(`This deletes set ${label} from stock. Its 2 tubes stay in their lot`)
    await tech.click(`[data-testid="delete-set-${label}-yes"]`)
    await card.waitFor({ state: 'detached' })
    const lotCard = tech.locator(`[data-testid="lot-${lot.id}"]`)
    await lotCard.locator('[data-testid^="delete-lot-"]').first().click()
    expect(await lotCard.locator('[data-testid$="-ask"]').textContent()).toContain('its 2 tube readings.')
    await lotCard.locator('[data-testid$="-yes"]').click()
    await lotCard.waitFor({ state: 'detached' })
    expect(await fitsThePhone(tech)).toBeLessThanOrEqual(360)
    await tech.context().setOffline(false)
    await tech.evaluate(() => window.dispatchEvent(new Event('online')))
    await expect.poll(async () => (await (await tech.request.get(`${BASE}/api/stock`)).json()).lots.some((l: { id: string }) => l.id === lot.id), { timeout: 30_000 }).toBe(false)
    await tech.context().close()
  })
})
