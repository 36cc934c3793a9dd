import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { describe, expect, it } from 'vitest'
import type { APIRequestContext, Page } from 'playwright-core'
import { BASE, hydrated, phone, browserForFile, pageAs } from './helpers/browser'

const MAIL_DIR = process.env.TW_TEST_MAIL_DIR ?? ''
const SHOP_ID = '6f1c2a10-0000-4000-8000-000000000001'

const browser = browserForFile()

const as = (email: string, path: string) => pageAs(browser, email, path)

const synced = (page: Page) => page.locator('header [data-testid="item-sync-state"][data-state="synced"]').first().waitFor({ timeout: 30_000 })

/** A walk-in customer's job with an hour of labour, checked in through the API as the desk. */
async function walkInJob(api: APIRequestContext, email: string) {
  const post = async (path: string, data: unknown) => {
    const r = await api.post(`${BASE}${path}`, { data })
    if (!r.ok()) throw new Error(`${path}: ${r.status()} ${await r.text()}`)
    return r.json()
  }
  const customer = await post('/api/customers', { name: 'Rae Walkin', email })
  const amp = await post('/api/amps', { customerId: customer.id, description: '18 W two-EL84 combo, cathode biased', serial: `WI-${randomUUID().slice(0, 6)}` })
  const job = await post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Crackles when warm' })
  return { customer, amp, job, post }
}

function payLinkIn(to: string): string | undefined {
  if (!MAIL_DIR || !existsSync(MAIL_DIR)) return undefined
  const mails = readdirSync(MAIL_DIR).filter(f => f.endsWith('.json')).sort()
    .map(f => JSON.parse(readFileSync(join(MAIL_DIR, f), 'utf8')) as { to: string | string[], raw: string })
    .filter(m => (Array.isArray(m.to) ? m.to : [m.to]).includes(to))
  return mails.map(m => m.raw.replace(/=\r?\n/g, '').match(/https?:\/\/[^\s]+\/pay\/[\w-]{43}/)?.[0]).filter(Boolean).at(-1)
}

describe('the shop\'s day at 360 x 800', () => {
  it('a part priced with a decimal comma reads as the right amount before it is added', async () => {
    const desk = await as('desk@larkspur.example', '/jobs')
    const { job } = await walkInJob(desk.request, `comma-${randomUUID().slice(0, 8)}@test.example`)
    const tech = await as('tech@larkspur.example', `/jobs/${job.id}`)
    await tech.locator('#part-description').waitFor({ timeout: 30_000 })
    await tech.fill('#part-description', 'Output transformer')
    await tech.fill('#part-quantity', '1')
    await tech.fill('#part-price', '89,50')
    await expect.poll(() => tech.textContent('[data-testid="part-price-reads"]')).toContain('Reads as $89.50')
    await tech.getByRole('button', { name: 'Add part' }).click()
    await tech.locator('[data-testid="job-parts"] li').first().waitFor()
    const parts = await tech.textContent('[data-testid="job-parts"]')
    expect(parts).toContain('$89.50')
    expect(parts).not.toContain('8,950')
    for (const p of [desk, tech]) await p.context().close()
  })

  it('the desk changes a job after check-in, offline, and the assigned tech finds it under My bench', async () => {
    const desk = await as('desk@larkspur.example', '/jobs')
    const { job } = await walkInJob(desk.request, `edit-${randomUUID().slice(0, 8)}@test.example`)
    await desk.goto(`${BASE}/jobs/${job.id}`)
    await hydrated(desk)
    await desk.getByTestId('job-edit-open').click({ timeout: 30_000 })
    await desk.context().setOffline(true)
    const owen = await desk.locator('#edit-tech option', { hasText: 'Owen Pryde' }).getAttribute('value')
    await desk.selectOption('#edit-tech', owen!)
    await desk.fill('#edit-promised', '2026-12-09')
    await desk.fill('#edit-complaint', 'Crackles when warm; also a loose input jack')
    await desk.fill('#edit-accessories', 'Footswitch')
    await desk.getByRole('button', { name: 'Save changes' }).click()
    const header = desk.locator('header.card').first()
    await expect.poll(() => header.textContent()).toContain('Owen Pryde')
    expect(await header.textContent()).toContain('2026-12-09')
    expect(await header.textContent()).toContain('loose input jack')
    await desk.context().setOffline(false)
    await synced(desk)

    const tech = await as('tech@larkspur.example', '/jobs')
    await tech.getByTestId('my-bench').check()
    await tech.locator(`[data-testid="job-card"][data-id="${job.id}"]`).waitFor({ timeout: 30_000 })
    for (const p of [desk, tech]) await p.context().close()
  })

  it('the owner sets the shop\'s contact and tax; the desk takes cash at the counter and sees the receipt', async () => {
    const owner = await as('owner@larkspur.example', '/shop')
    await owner.getByTestId('settings-link').click()
    await owner.locator('#set-address').waitFor()
    await owner.fill('#set-address', 'Unit 3, 18 Kiln Row')
    await owner.fill('#set-tax', '8,25')
    await expect.poll(() => owner.textContent('#set-tax-reads')).toContain('8.25 %')
    await owner.fill('#set-email', 'not an address')
    await owner.getByRole('button', { name: 'Save settings' }).click()
    expect(await owner.textContent('#set-email-error')).toContain('enter a valid e-mail address')
    await owner.fill('#set-email', 'desk@larkspur.example')
    await owner.getByRole('button', { name: 'Save settings' }).click()
    await owner.getByTestId('settings-saved').waitFor()

    const desk = await as('desk@larkspur.example', '/jobs')
    const { job, post } = await walkInJob(desk.request, `cash-${randomUUID().slice(0, 8)}@test.example`)
    const push = await owner.request.post(`${BASE}/api/sync/push`, { data: { clientId: randomUUID(), shopId: SHOP_ID, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 1, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes: 60, rateCents: 9000, description: 'Retube and bias' } }] } })
    expect(push.ok()).toBe(true)
    await post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })
    await desk.goto(`${BASE}/jobs/${job.id}`)
    await hydrated(desk)
    await desk.getByTestId('counter-pay').click({ timeout: 30_000 })
    const form = desk.getByTestId('counter-pay-form')
    // Source: arithmetic by hand: 60 min at $90.00/h = $90.00; 8.25 % tax = $7.425 -> $7.43; total $97.43.
    expect(await form.textContent()).toContain('Take $97.43 at the counter')
    expect(await desk.getByTestId('counter-pay-confirm').isDisabled()).toBe(true)
    await form.getByRole('radio', { name: 'Cash' }).check()
    await desk.getByTestId('counter-pay-confirm').click()
    await desk.locator('[data-kind="invoice"][data-state="paid"]').waitFor({ timeout: 30_000 })
    const receipt = await desk.getByTestId('pay-receipt').textContent()
    expect(receipt).toContain('Receipt: paid $97.43')
    expect(receipt).toContain('cash at the counter')
    for (const p of [owner, desk]) await p.context().close()
  })

  it('a walk-in customer with no account opens the e-mailed link, confirms, pays and gets the receipt', async () => {
    const email = `walkin-${randomUUID().slice(0, 8)}@test.example`
    const desk = await as('desk@larkspur.example', '/jobs')
    const { job, post } = await walkInJob(desk.request, email)
    const owner = await as('owner@larkspur.example', '/')
    await owner.request.post(`${BASE}/api/sync/push`, { data: { clientId: randomUUID(), shopId: SHOP_ID, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 1, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes: 30, rateCents: 9000, description: 'Clean the input jack' } }] } })
    await post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })
    // The desk sends it from the job page; the e-mail carries the pay link.
    await desk.goto(`${BASE}/jobs/${job.id}`)
    await hydrated(desk)
    await desk.getByRole('button', { name: 'Mark sent' }).click({ timeout: 30_000 })
    await desk.locator('[data-kind="invoice"][data-state="sent"]').waitFor({ timeout: 30_000 })
    await expect.poll(() => payLinkIn(email), { timeout: 15_000 }).toBeTruthy()
    const link = payLinkIn(email)!

    // A browser that never signed in.
    const customer = await (await phone(browser)).newPage()
    await customer.goto(link)
    await hydrated(customer)
    await customer.getByTestId('pay').waitFor({ timeout: 30_000 })
    expect(customer.url()).toBe(link)
    expect(await customer.getByTestId('pay-shop').textContent()).toContain('Larkspur Amp Works')
    expect(await customer.getByTestId('pay-lines').textContent()).toContain('Clean the input jack')
    // Source: arithmetic by hand: 30 min at $90.00/h = $45.00; 8.25 % tax = $3.7125 -> $3.71; total $48.71.
    expect(await customer.getByTestId('pay-total').textContent()).toContain('$48.71')
    await customer.getByTestId('pay').click()
    const confirm = customer.getByTestId('pay-confirm')
    expect(await confirm.textContent()).toContain('Pay $48.71 for invoice')
    await customer.getByRole('button', { name: 'Not now' }).click()
    await customer.getByTestId('pay').click()
    await customer.getByTestId('pay-confirm-button').click()
    await customer.getByTestId('pay-receipt').waitFor({ timeout: 60_000 })
    expect(await customer.getByTestId('pay-receipt').textContent()).toContain('Receipt: paid $48.71')

    const paid = await desk.request.get(`${BASE}/api/jobs/${job.id}`)
    expect((await paid.json()).invoices.map((i: { state: string }) => i.state)).toEqual(['paid'])
    for (const p of [desk, owner, customer]) await p.context().close()
  })
})
