import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { apiLogin, BASE, hydrated, phone, browserForFile, openWithServiceWorker } from './helpers/browser'

const browser = browserForFile({ artifacts: true })

const chip = (page: Page, state?: string) => page.locator(`[data-testid="sync-chip"]${state ? `[data-state="${state}"]` : ''}`)

describe('offline first, in the browser', () => {
  it('opens with no network, keeps a note written offline, and sends it to another member after reconnecting', async () => {
    const context = await phone(browser)
    const page = await context.newPage()
    const errors: string[] = []
    page.on('pageerror', e => errors.push(e.message))
    await apiLogin(page, 'tech@larkspur.example')

    // First visit online: the service worker installs and precaches the app.
    expect(await openWithServiceWorker(page, '/notebook')).toBe(true)
    await chip(page, 'synced').waitFor({ timeout: 20_000 })

    // No network at all: the shell still opens, from the service worker.
    await context.setOffline(true)
    await page.reload()
    await hydrated(page)
    await page.getByRole('heading', { name: 'Notebook' }).waitFor()
    expect(await page.evaluate(() => navigator.onLine)).toBe(false)

    const body = `Offline note ${Date.now()}: two-6V6 combo, hum at idle, filter caps next.`
    await page.getByRole('button', { name: 'New note' }).click()
    await page.getByLabel('Title').fill('Bench, no signal')
    await page.getByLabel('Note', { exact: true }).fill(body)
    await page.getByRole('button', { name: 'Save note' }).click()
    const item = page.locator('[data-testid="notebook-note"]', { hasText: body })
    await item.waitFor()
    expect(await item.locator('[data-testid="item-sync-state"]').getAttribute('data-state')).toBe('local')
    expect(await item.textContent()).toContain('on this device')
    await chip(page, 'local').waitFor()
    expect(await chip(page).textContent()).toMatch(/on this device\s*1/)
    await page.screenshot({ path: 'tests/artifacts/offline-notebook.png', fullPage: true })

    // The note survives a reload with no network (it lives in IndexedDB, not in memory).
    await page.reload()
    await hydrated(page)
    await item.waitFor()

    // Back online: the change goes out and the chip says so.
    await context.setOffline(false)
    await chip(page, 'synced').waitFor({ timeout: 30_000 })
    await item.locator('[data-testid="item-sync-state"][data-state="synced"]').waitFor()
    await page.screenshot({ path: 'tests/artifacts/offline-notebook-synced.png', fullPage: true })

    // Another member of the shop, in a separate browser, sees it.
    const other = await phone(browser)
    const page2 = await other.newPage()
    await apiLogin(page2, 'owner@larkspur.example')
    await page2.goto(`${BASE}/notebook`)
    await hydrated(page2)
    const seen = page2.locator('[data-testid="notebook-note"]', { hasText: body })
    await seen.waitFor({ timeout: 20_000 })
    expect(await seen.textContent()).toContain('another member')
    expect(await seen.locator('[data-testid="item-sync-state"]').getAttribute('data-state')).toBe('synced')
    await page2.screenshot({ path: 'tests/artifacts/offline-note-on-second-browser.png', fullPage: true })

    expect(errors).toEqual([])
    await other.close()
    await context.close()
  })
})
