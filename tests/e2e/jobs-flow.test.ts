import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { PDFParse } from 'pdf-parse'
import { BASE, hydrated, browserForFile, pageAs } from './helpers/browser'

const MAIL_DIR = process.env.TW_TEST_MAIL_DIR ?? ''
const PLAYER = 'dana@players.example'
const SERIAL = `LW-6V6-${Date.now().toString().slice(-6)}`
// A 1×1 PNG (one opaque pixel), built here so the test carries no binary file.
const PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64')

const browser = browserForFile()

const as = (email: string, path: string) => pageAs(browser, email, path)

/** Waits until this device has sent everything and heard back from the server. */
async function synced(page: Page) {
  await page.locator('header [data-testid="item-sync-state"][data-state="synced"]').first().waitFor({ timeout: 30_000 })
}

function mailTo(to: string): { to: string | string[], raw: string }[] {
  if (!MAIL_DIR || !existsSync(MAIL_DIR)) return []
  return readdirSync(MAIL_DIR).filter(f => f.endsWith('.json')).sort()
    .map(f => JSON.parse(readFileSync(join(MAIL_DIR, f), 'utf8')) as { to: string | string[], raw: string })
    .filter(m => (Array.isArray(m.to) ? m.to : [m.to]).includes(to))
}

describe('a job from check-in to hand-back, on phones', () => {
  it('desk checks in, tech works it, the player pays, the record prints', async () => {
    // Desk: a new customer linked to the player's account, the amp, a photo.
    const desk = await as('desk@larkspur.example', '/jobs/new')
    await desk.getByTestId('new-customer').click()
    await desk.fill('#ci-customer-name', 'Dana Whitlow')
    await desk.fill('#ci-customer-email', PLAYER)
    await desk.locator(`#ci-customer-player option:has-text("${PLAYER}")`).waitFor({ state: 'attached' })
    const playerOption = await desk.locator(`#ci-customer-player option:has-text("${PLAYER}")`).getAttribute('value')
    await desk.selectOption('#ci-customer-player', playerOption!)
    await desk.fill('#ci-amp-description', 'two-6V6 combo, fixed bias')
    await desk.fill('#ci-amp-serial', SERIAL)
    await desk.fill('#ci-amp-tubeComplement', '2 × 6V6GTA')
    await desk.fill('#ci-complaint', 'Hum at idle, one power tube glows orange')
    await desk.setInputFiles('[data-testid="photo-input"]', { name: 'amp.png', mimeType: 'image/png', buffer: PNG })
    await desk.locator('ul[aria-label="Photos"] img').waitFor()
    await desk.getByRole('button', { name: 'Check it in' }).click()
    await desk.waitForURL(/\/jobs\/[0-9a-f-]{36}$/)
    const jobId = desk.url().split('/').at(-1)!
    expect(await desk.textContent('[data-testid="job-serial"]')).toBe(SERIAL)
    await synced(desk)

    // Tech: on the bench, an idle dissipation reading saved to the job, a part, labour, ready.
    const tech = await as('tech@larkspur.example', `/jobs/${jobId}`)
    await tech.locator('[data-move="on-bench"]').click()
    await tech.locator('[data-testid="job-status"][data-status="on-bench"]').first().waitFor()
    await tech.locator('[data-measure="idle-dissipation"]').click()
    await tech.waitForURL(new RegExp(`/bench/idle-dissipation\\?job=${jobId}`))
    await tech.selectOption('#idle-tube', '6v6gta')
    await tech.getByRole('radio', { name: 'Fixed bias' }).click()
    await tech.fill('#idle-plate-volts', '285')
    await tech.getByRole('radio', { name: /^Current read directly/ }).click()
    await tech.fill('#idle-amps', '35 mA')
    // Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V, 35 mA per tube -> 9.98 W
    await expect.poll(() => tech.textContent('[data-testid="watts"]')).toBe('9.98 W')
    expect(await tech.inputValue('[data-testid="save-target"]')).toBe(jobId)
    await tech.getByRole('button', { name: 'Save to the job' }).click()
    await tech.getByTestId('back-to-job').click()
    await tech.locator('[data-testid="job-measurements"] li').first().waitFor()
    expect(await tech.textContent('[data-testid="job-measurements"]')).toContain('9.98 W')
    await tech.fill('#part-description', 'Matched pair 6V6GT')
    await tech.fill('#part-quantity', '1')
    await tech.fill('#part-price', '64.00')
    await tech.getByRole('button', { name: 'Add part' }).click()
    await tech.fill('#labour-minutes', '60')
    await tech.fill('#labour-rate', '85.00')
    await tech.getByRole('button', { name: 'Add labour' }).click()
    await tech.locator('[data-testid="job-labour"] li').waitFor()
    await tech.locator('[data-move="ready"]').click()
    await tech.locator('[data-testid="job-status"][data-status="ready"]').first().waitFor()
    await synced(tech)

    // The ready e-mail reaches the customer.
    await expect.poll(() => mailTo(PLAYER).length, { timeout: 30_000 }).toBeGreaterThan(0)
    expect(mailTo(PLAYER).at(-1)!.raw).toMatch(/ready/i)

    // Desk: invoice, then sent.
    await desk.reload()
    await hydrated(desk)
    await desk.getByRole('button', { name: 'Create invoice' }).click()
    await desk.locator('[data-kind="invoice"][data-state="draft"]').waitFor({ timeout: 30_000 })
    await desk.getByRole('button', { name: 'Mark sent' }).click()
    await desk.locator('[data-kind="invoice"][data-state="sent"]').waitFor({ timeout: 30_000 })

    // Player: sees the job and the invoice, pays, and sees it paid.
    const player = await as(PLAYER, '/jobs')
    await player.locator(`[data-testid="job-card"][data-id="${jobId}"]`).waitFor({ timeout: 30_000 })
    await player.goto(`${BASE}/jobs/${jobId}`)
    await hydrated(player)
    await player.locator('[data-kind="invoice"][data-state="sent"]').waitFor({ timeout: 30_000 })
    await player.getByTestId('pay').click()
    // Paying asks first, with the amount and what it is for; nothing is paid until confirmed.
    const confirm = player.getByTestId('pay-confirm')
    await confirm.waitFor()
    const total = (await player.locator('[data-kind="invoice"][data-state="sent"] .num.font-semibold').first().textContent())!.trim()
    expect(await confirm.textContent()).toContain(`Pay ${total} for invoice`)
    await player.getByRole('button', { name: 'Not now' }).click()
    await player.getByTestId('pay').waitFor()
    expect(await player.locator('[data-kind="invoice"][data-state="sent"]').count()).toBe(1)
    await player.getByTestId('pay').click()
    await player.getByTestId('pay-confirm-button').click()
    await player.locator('[data-kind="invoice"][data-state="paid"]').waitFor({ timeout: 60_000 })
    expect(await player.getByTestId('pay-receipt').textContent()).toContain(`Receipt: paid ${total}`)

    // The service record prints.
    await player.goto(`${BASE}/jobs/${jobId}/record`)
    await hydrated(player)
    await player.getByTestId('qr-tag').waitFor()
    await player.emulateMedia({ media: 'print' })
    const pdf = await player.pdf({ format: 'A4' })
    const parsed = await new PDFParse({ data: new Uint8Array(pdf) }).getText()
    expect(parsed.total).toBeGreaterThanOrEqual(1)
    expect(parsed.text).toContain(SERIAL)
    expect(parsed.text).toContain('Lethal voltages remain')
    for (const p of [desk, tech, player]) await p.context().close()
  })
})
