import { mkdirSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { DEMO_JOBS } from '../../server/db/demo'
import { apiLogin, BASE, hydrated, launch, phone, openWithServiceWorker } from './helpers/browser'

let browser: Browser
beforeAll(async () => {
  browser = await launch()
  mkdirSync('tests/artifacts', { recursive: true })
})
afterAll(async () => {
  await browser?.close()
})

const chip = (page: Page, state?: string) => page.locator(`[data-testid="sync-chip"]${state ? `[data-state="${state}"]` : ''}`)

describe('a player\'s rigs in the browser', () => {
  it('shows the readings chart and the backstage view at 360x800, dark, with the network cut', async () => {
    const context = await phone(browser, { colorScheme: 'dark' })
    const page = await context.newPage()
    const errors: string[] = []
    page.on('pageerror', e => errors.push(e.message))
    await apiLogin(page, 'dana@players.example')

    // First visit online: the service worker installs, and the personal space syncs down.
    expect(await openWithServiceWorker(page, '/rigs')).toBe(true)
    const combo = page.locator('[data-testid="rig-card"]', { hasText: '18 W two-EL84 combo' })
    await combo.waitFor({ timeout: 20_000 })
    await chip(page, 'synced').waitFor({ timeout: 20_000 })

    // No network at all.
    await context.setOffline(true)
    await page.reload()
    await hydrated(page)
    await combo.waitFor()
    expect(await page.evaluate(() => navigator.onLine)).toBe(false)
    await combo.click()
    await page.getByRole('heading', { name: '18 W two-EL84 combo, cathode biased' }).waitFor()
    expect(await page.getByRole('complementary', { name: 'Inside the chassis is for qualified people' }).textContent()).toContain('Measurements inside the chassis are for qualified people')

    // The chart: one line per power tube position, a point per reading of every set (old and new).
    const chart = page.locator('[data-testid="readings-chart"]')
    await chart.waitFor()
    const series = chart.locator('[data-testid="chart-series"]')
    expect(await series.count()).toBe(2)
    expect(await series.nth(0).getAttribute('data-position')).toBe('V4')
    expect(await series.nth(0).locator('path').count()).toBeGreaterThanOrEqual(8)
    const box = await chart.boundingBox()
    expect(box!.width).toBeLessThanOrEqual(360)
    expect(box!.width).toBeGreaterThan(250)
    await page.screenshot({ path: 'tests/artifacts/rigs-rig-offline-dark.png', fullPage: true })

    // "+ gig" with no signal: it shows at once, on this device.
    await page.getByLabel('Hours').fill('2.5')
    await page.getByRole('button', { name: '+ gig' }).click()
    await chip(page, 'local').waitFor()

    // The backstage view, still offline: last readings with band word and shape, tubes' age, the reminder, the check.
    await page.getByRole('link', { name: 'Backstage view ›' }).click()
    const stage = page.locator('[data-testid="backstage"]')
    await stage.waitFor()
    const readings = stage.locator('[data-testid="reading"]')
    expect(await readings.count()).toBe(2)
    const band = readings.first().locator('[data-testid="band"]')
    expect(await band.textContent()).toMatch(/cold|in range|warm|over/)
    expect(await band.locator('svg').count()).toBe(1)
    const fontSize = await readings.first().locator('p').first().evaluate(el => Number.parseFloat(getComputedStyle(el).fontSize))
    expect(fontSize).toBeGreaterThanOrEqual(28)
    expect(await stage.locator('[data-testid="fitted-age"]').textContent()).toMatch(/Fitted set: \d+ months/)
    expect(await stage.locator('[data-testid="spare-age"]').count()).toBe(1)
    await stage.locator('[data-testid="rig-reminder"]').waitFor()
    expect(await stage.locator('[data-testid="backstage-check"]').getAttribute('href')).toBe('/procedures/backstage-check')
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
    expect(overflow).toBe(0)
    await page.screenshot({ path: 'tests/artifacts/rigs-backstage-offline-dark.png', fullPage: true })

    // A reload with no network opens the same view from the device.
    await page.reload()
    await hydrated(page)
    await stage.waitFor()

    // Back online: the gig goes out.
    await context.setOffline(false)
    await chip(page, 'synced').waitFor({ timeout: 30_000 })
    expect(errors).toEqual([])
    await context.close()
  })

  it('reads in the light theme too', async () => {
    const context = await phone(browser, { colorScheme: 'light' })
    const page = await context.newPage()
    await apiLogin(page, 'sam@players.example')
    await page.goto(`${BASE}/rigs?theme=light`)
    await hydrated(page)
    const card = page.locator('[data-testid="rig-card"]').first()
    await card.waitFor({ timeout: 20_000 })
    await page.screenshot({ path: 'tests/artifacts/rigs-list-light.png', fullPage: true })
    await card.click()
    await page.locator('[data-testid="readings-chart"]').waitFor()
    await page.screenshot({ path: 'tests/artifacts/rigs-rig-light.png', fullPage: true })
    await page.getByRole('link', { name: 'Backstage view ›' }).click()
    await page.locator('[data-testid="backstage"]').waitFor()
    await page.screenshot({ path: 'tests/artifacts/rigs-backstage-light.png', fullPage: true })
    await context.close()
  })

  it('the shop suggests retube thresholds with no signal; the player sees who suggested them and adopts them offline', async () => {
    // The bench: Owen opens the job on Dana's shared combo, cuts the network and suggests.
    const techContext = await phone(browser, { colorScheme: 'dark' })
    const tech = await techContext.newPage()
    await apiLogin(tech, 'tech@larkspur.example')
    expect(await openWithServiceWorker(tech, `/jobs/${DEMO_JOBS[0]!.id}`)).toBe(true)
    const form = tech.locator('[data-testid="rig-suggest"]')
    await form.waitFor({ timeout: 20_000 })
    await chip(tech, 'synced').waitFor({ timeout: 20_000 })
    await techContext.setOffline(true)
    await tech.getByLabel('After hours played').fill('140')
    await tech.getByLabel('or months').fill('10')
    await tech.click('[data-testid="rig-suggest-go"]')
    await form.getByText('Saved on this device').waitFor()
    await chip(tech, 'local').waitFor()
    await tech.screenshot({ path: 'tests/artifacts/rigs-suggest-offline-dark.png', fullPage: true })
    await techContext.setOffline(false)
    await tech.evaluate(() => window.dispatchEvent(new Event('online')))
    await chip(tech, 'synced').waitFor({ timeout: 30_000 })
    await techContext.close()

    // The player: online once, then with no signal; her own thresholds stay until she adopts.
    const context = await phone(browser, { colorScheme: 'dark' })
    const page = await context.newPage()
    await apiLogin(page, 'dana@players.example')
    expect(await openWithServiceWorker(page, '/rigs')).toBe(true)
    await page.locator('[data-testid="rig-card"]', { hasText: '18 W two-EL84 combo' }).click()
    const suggestion = page.locator('[data-testid="rig-suggestion"]', { hasText: '140 h played or 10 months' })
    await suggestion.waitFor({ timeout: 20_000 })
    await chip(page, 'synced').waitFor({ timeout: 20_000 })
    expect(await suggestion.textContent()).toContain('Owen Pryde')
    expect(await suggestion.textContent()).toContain('Larkspur Amp Works')
    const reminder = page.locator('[data-testid="rig-reminder"]')
    expect(await reminder.textContent()).not.toContain('140 h')

    await context.setOffline(true)
    await page.reload()
    await hydrated(page)
    await suggestion.waitFor()
    await suggestion.locator('[data-testid="adopt-suggestion"]').click()
    await suggestion.locator('[data-testid="suggestion-in-use"]').waitFor()
    await chip(page, 'local').waitFor()
    await page.getByRole('button', { name: 'Edit rig and reminder' }).click()
    expect(await page.locator('#rig-hours').inputValue()).toBe('140')
    expect(await page.locator('#rig-months').inputValue()).toBe('10')
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth)
    expect(overflow).toBe(0)
    await page.screenshot({ path: 'tests/artifacts/rigs-suggestion-adopted-offline-dark.png', fullPage: true })
    await context.setOffline(false)
    await page.evaluate(() => window.dispatchEvent(new Event('online')))
    await chip(page, 'synced').waitFor({ timeout: 30_000 })
    await context.close()
  }, 150_000)

  it('deletes a rig after saying what goes with it', async () => {
    const context = await phone(browser, { colorScheme: 'light' })
    const page = await context.newPage()
    await apiLogin(page, 'sam@players.example')
    expect(await openWithServiceWorker(page, '/rigs')).toBe(true)
    await page.locator('[data-testid="rig-card"]').first().waitFor({ timeout: 20_000 })
    await page.click('[data-testid="add-rig"]')
    await page.fill('#rig-description', 'spare practice amp, cathode bias')
    await page.getByRole('button', { name: 'Save rig' }).click()
    await page.getByRole('heading', { name: 'spare practice amp, cathode bias' }).waitFor()
    await page.getByLabel('Hours').fill('1.5')
    await page.getByRole('button', { name: '+ gig' }).click()
    await page.click('[data-testid="delete-rig"]')
    expect(await page.locator('[data-testid="delete-rig-ask"]').textContent()).toContain('its 0 tube sets with their readings and its 1 gig.')
    await page.click('[data-testid="delete-rig-yes"]')
    await page.waitForURL(/\/rigs$/)
    await page.locator('[data-testid="rig-card"]').first().waitFor()
    expect(await page.locator('[data-testid="rig-card"]', { hasText: 'spare practice amp' }).count()).toBe(0)
    await chip(page, 'synced').waitFor({ timeout: 30_000 })
    await context.close()
  })
})
