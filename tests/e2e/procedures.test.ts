import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import type { Page } from 'playwright-core'
import { apiLogin, BASE, hydrated, phone, browserForFile, openWithServiceWorker } from './helpers/browser'

const browser = browserForFile({ artifacts: true })

const chip = (page: Page, state: string) => page.locator(`[data-testid="sync-chip"][data-state="${state}"]`)
const next = (page: Page) => page.getByTestId('step-next').click()
const heading = (page: Page) => page.getByTestId('step-heading')

/** A fresh job on a two-6V6 fixed-bias combo, made through the API as the desk would. */
async function newJob(page: Page): Promise<string> {
  const post = async (path: string, data: object) => {
    const r = await page.request.post(`${BASE}${path}`, { data })
    if (!r.ok()) throw new Error(`${path}: ${r.status()} ${await r.text()}`)
    return (await r.json()) as { id: string }
  }
  const customer = await post('/api/customers', { name: 'Sam Okafor' })
  const amp = await post('/api/amps', { customerId: customer.id, description: 'two-6V6 combo, fixed bias', serial: `LAW-P${Date.now().toString().slice(-5)}`, tubeComplement: '2 x 12AX7, 2 x 6V6GTA', powerTubeCount: 2, biasMode: 'fixed' })
  const job = await post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Needs new power tubes and the bias set' })
  return job.id
}

/** Fill the inline Idle dissipation tool: a 6V6GTA (14 W) at 400 V, the sense voltage in mV across 1 Ω. */
async function idleReading(page: Page, senseMillivolts: string) {
  // The tool starts with the job's amp's power tube, from its tube complement.
  expect(await page.inputValue('#idle-tube')).toBe('6v6gta')
  await page.selectOption('#idle-tube', '6v6gta')
  await page.fill('#idle-plate-volts', '400')
  await page.fill('#idle-sense-ohms', '1')
  expect(await page.inputValue('#idle-sense-volts')).toBe('')
  await page.fill('#idle-sense-volts', senseMillivolts)
}

async function confirmAndGo(page: Page) {
  await page.getByTestId('step-confirm').click()
  await next(page)
}

async function waitOut(page: Page, time: string) {
  await page.getByTestId('hold-start').click()
  expect(await page.getByTestId('step-next').isDisabled()).toBe(true)
  await page.clock.fastForward(time)
  await page.locator('[data-testid="hold-clock"]', { hasText: 'Wait over' }).waitFor()
}

describe('a guided procedure, on a phone', () => {
  it('will not reach step 1 before every safety item is ticked, then sets fixed bias offline with the readings on the job', async () => {
    const context = await phone(browser)
    const page = await context.newPage()
    const errors: string[] = []
    page.on('pageerror', e => errors.push(e.message))
    await page.clock.install()
    await apiLogin(page, 'owner@larkspur.example')
    const jobId = await newJob(page)
    await apiLogin(page, 'tech@larkspur.example')

    // Online once so the service worker precaches every screen, then the job reaches this device.
    await openWithServiceWorker(page, `/jobs/${jobId}`)
    await page.getByTestId('run-procedure').waitFor({ timeout: 20_000 })
    await chip(page, 'synced').waitFor({ timeout: 20_000 })

    // A deep link into a step of a run with no safety check goes to the check.
    await page.goto(`${BASE}/procedures/set-fixed-bias/run/${randomUUID()}?step=measure-initial:1`)
    await hydrated(page)
    await page.getByTestId('gate-needed').waitFor()
    expect(new URL(page.url()).pathname).toBe('/procedures/set-fixed-bias')

    // From the job: the procedure list, then the procedure with this job chosen.
    await page.goto(`${BASE}/jobs/${jobId}`)
    await hydrated(page)
    await page.getByTestId('run-procedure').click()
    await page.locator('[data-procedure="set-fixed-bias"]').click()
    await page.getByTestId('gate').waitFor()
    expect(await page.inputValue('[data-testid="run-job"]')).toBe(jobId)
    expect(await page.inputValue('#run-tubes')).toBe('2')

    // Every item is ticked separately; step 1 stays shut until the last one.
    await context.setOffline(true)
    const items = page.locator('[data-gate-item]')
    const count = await items.count()
    expect(count).toBeGreaterThanOrEqual(5)
    for (let i = 0; i < count; i++) {
      expect(await page.getByTestId('start-run').isDisabled(), `start open with ${i} of ${count} ticked`).toBe(true)
      await items.nth(i).click()
    }
    await page.getByTestId('gate-left').filter({ hasText: 'All items ticked.' }).waitFor()
    await page.screenshot({ path: 'tests/artifacts/procedure-gate.png', fullPage: true })
    await page.getByTestId('start-run').click()

    await heading(page).filter({ hasText: 'Connect the load' }).waitFor()
    const runId = new URL(page.url()).pathname.split('/run/')[1]!
    await confirmAndGo(page)
    await heading(page).filter({ hasText: 'Clip the meter on' }).waitFor()
    await confirmAndGo(page)
    await heading(page).filter({ hasText: 'Power up and settle' }).waitFor()
    await page.getByTestId('step-confirm').click()
    await waitOut(page, '02:01')
    await next(page)

    await heading(page).filter({ hasText: 'Measure the idle current: tube 1 of 2' }).waitFor()
    await idleReading(page, '28')
    // Source: 28 mA cathode − 5 % screen = 26.6 mA; P = 400 V × 26.6 mA = 10.6 W = 76 % of 14 W (P = V·I).
    await page.getByTestId('step-value').filter({ hasText: '76.0 %' }).waitFor()
    await page.screenshot({ path: 'tests/artifacts/procedure-step-tool.png', fullPage: true })
    await next(page)
    await heading(page).filter({ hasText: 'tube 2 of 2' }).waitFor()

    // Interrupted: the page is reloaded with no signal; the run resumes where it stopped.
    await page.goto(`${BASE}/procedures`)
    await hydrated(page)
    await page.locator(`[data-testid="resume-run"][href$="/run/${runId}"]`).click()
    await heading(page).filter({ hasText: 'Measure the idle current: tube 2 of 2' }).waitFor()
    await idleReading(page, '30')
    await next(page)

    await heading(page).filter({ hasText: 'Adjust the bias' }).waitFor()
    await page.getByTestId('step-confirm').click()
    await waitOut(page, '02:01')
    await next(page)

    // 76 % is above the 50–70 % band: the run stops and says why.
    await heading(page).filter({ hasText: 'Measure again: tube 1 of 2' }).waitFor()
    await idleReading(page, '28')
    await next(page)
    const stop = page.getByTestId('step-stop')
    await stop.waitFor()
    expect(await stop.textContent()).toContain('Outside the in-range band for fixed bias')
    await page.screenshot({ path: 'tests/artifacts/procedure-stop.png', fullPage: true })
    await page.getByTestId('measure-again').click()
    // Source: 20 mA − 5 % = 19 mA; 400 V × 19 mA = 7.6 W = 54 % of 14 W (P = V·I).
    await idleReading(page, '20')
    await page.getByTestId('step-value').filter({ hasText: '54.3 %' }).waitFor()
    await next(page)
    await heading(page).filter({ hasText: 'Measure again: tube 2 of 2' }).waitFor()
    await idleReading(page, '21')
    await next(page)

    await heading(page).filter({ hasText: 'Power down' }).waitFor()
    await confirmAndGo(page)
    await page.getByTestId('finish-run').click()
    await page.getByTestId('run-outcome').filter({ hasText: 'Passed, with warnings' }).waitFor()
    expect(await page.getByTestId('run-gate').textContent()).toMatch(/acknowledged by Owen Pryde/)
    await page.screenshot({ path: 'tests/artifacts/procedure-summary.png', fullPage: true })

    // Interrupted nothing, lost nothing: everything waited on the device, and goes out once back online.
    await context.setOffline(false)
    await chip(page, 'synced').waitFor({ timeout: 30_000 })
    const r = await page.request.get(`${BASE}/api/procedure-runs?job=${jobId}`)
    expect(r.status()).toBe(200)
    const { items: runs } = (await r.json()) as { items: { status: string, readings: Record<string, { value?: number, measurementId?: string }>, gate: { items: string[], createdBy: string } }[] }
    expect(runs).toHaveLength(1)
    expect(runs[0]!.status).toBe('done')
    expect(runs[0]!.gate.items).toHaveLength(count)
    expect(runs[0]!.readings['measure-final:1']!.value).toBeCloseTo(0.543, 3)
    // Four readings stand on the run; the out-of-range one was measured again but stays on the job.
    expect(Object.values(runs[0]!.readings).filter(x => x.measurementId)).toHaveLength(4)

    // The job and its service record show the run with who acknowledged the check.
    await page.getByTestId('run-to-job').click()
    await page.locator('[data-testid="job-procedures"] [data-testid="run-outcome"]').filter({ hasText: 'Passed, with warnings' }).waitFor()
    expect(await page.locator('[data-testid="job-measurements"] li').count()).toBe(5)
    await page.getByTestId('record-link').click()
    const record = page.getByTestId('record-procedures')
    await record.waitFor()
    expect(await record.textContent()).toMatch(/Set fixed bias[\s\S]*acknowledged by Owen Pryde/)
    // The percentages come with the current and voltage behind them, and dates that stay true on paper.
    expect(await record.getByTestId('run-reading-behind').first().textContent()).toMatch(/\d+(\.\d+)? mA at \d+(\.\d+)? V/)
    expect(await record.textContent()).toMatch(/\d{1,2} [A-Z][a-z]{2} \d{4} \d{2}:\d{2}/)
    await page.screenshot({ path: 'tests/artifacts/procedure-record.png', fullPage: true })

    expect(errors).toEqual([])
    await context.close()
  })
})
