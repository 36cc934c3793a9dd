import { describe, expect, it } from 'vitest'
import { BASE, DEMO_PASSWORD, hydrated, pageAs, phone, browserForFile } from './helpers/browser'

const browser = browserForFile({ artifacts: true })

describe('the app shell at 360 x 800', () => {
  it('sends a signed-out visitor to sign in, then signs the demo tech in and shows the shell', async () => {
    const context = await phone(browser)
    const page = await context.newPage()
    await page.goto(`${BASE}/jobs`)
    await hydrated(page)
    await page.waitForURL(/\/signin/)
    // Signed out there is nothing to sync: the sync engine and its database library stay unloaded.
    await page.waitForLoadState('networkidle')
    const scriptsHolding = async (word: string) => {
      const urls = await page.evaluate(() => performance.getEntriesByType('resource').map(e => e.name).filter(n => /\.js(\?|$)/.test(n)))
      const texts = await Promise.all([...new Set(urls)].map(async u => (await fetch(u)).text()))
      return texts.filter(t => t.includes(word)).length
    }
    expect(await scriptsHolding('Dexie')).toBe(0)
    await page.getByLabel('E-mail').fill('tech@larkspur.example')
    await page.getByLabel('Password').fill(DEMO_PASSWORD)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/jobs$/)
    const nav = page.getByRole('navigation', { name: 'Main' })
    for (const label of ['Bench', 'Procedures', 'Jobs', 'Rigs', 'More']) {
      await nav.getByRole('link', { name: label }).waitFor()
    }
    await expect.poll(() => scriptsHolding('Dexie')).toBeGreaterThan(0)
    // The header names the active shop: as text, or as the switcher's choice when the tech has more
    // than one shop (other suites give the demo tech a shop of their own).
    const shopShown = await page.locator('header').evaluate((h) => {
      const picker = h.querySelector('select')
      return picker ? picker.selectedOptions[0]?.textContent?.trim() : h.textContent
    })
    expect(shopShown).toContain('Larkspur Amp Works')
    // Touch targets of the bottom navigation are at least 44 px high.
    const box = await nav.getByRole('link', { name: 'Bench' }).boundingBox()
    expect(box!.height).toBeGreaterThanOrEqual(44)
    // Nothing wider than the phone.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(360)
    await page.screenshot({ path: 'tests/artifacts/shell-jobs.png', fullPage: true })

    await nav.getByRole('link', { name: 'More' }).click()
    await page.getByRole('link', { name: /Account/ }).click()
    await page.getByText('Owen Pryde', { exact: true }).waitFor()
    await page.getByRole('radio', { name: 'Light' }).click()
    expect(await page.evaluate(() => document.documentElement.classList.contains('light'))).toBe(true)
    await page.screenshot({ path: 'tests/artifacts/shell-account-light.png', fullPage: true })
    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/signin/)
    await context.close()
  })

  it('shows a wrong-password message without saying whether the e-mail exists', async () => {
    const context = await phone(browser)
    const page = await context.newPage()
    await page.goto(`${BASE}/signin`)
    await hydrated(page)
    await page.getByLabel('E-mail').fill('nobody@test.example')
    await page.getByLabel('Password').fill('wrong-password-here')
    await page.getByRole('button', { name: 'Sign in' }).click()
    expect(await page.getByRole('alert').textContent()).toContain('Wrong e-mail or password')
    await context.close()
  })

  it('lets the owner invite a member and shows the link', async () => {
    const context = await phone(browser)
    const page = await context.newPage()
    await page.request.post(`${BASE}/api/auth/login`, { data: { email: 'owner@larkspur.example', password: DEMO_PASSWORD } })
    await page.goto(`${BASE}/shop`)
    await hydrated(page)
    await page.getByText('Owen Pryde', { exact: true }).waitFor()
    const email = `browser-invite-${Date.now()}@test.example`
    await page.getByLabel('E-mail', { exact: true }).fill(email)
    await page.getByLabel('Role', { exact: true }).selectOption('tech')
    await page.getByRole('button', { name: 'Send invitation' }).click()
    const link = page.getByTestId('invite-link')
    await link.waitFor()
    expect(await link.textContent()).toContain('/invite/')
    const url = (await link.locator('p').nth(1).textContent())!.trim()
    await page.screenshot({ path: 'tests/artifacts/shop-members.png', fullPage: true })

    const guest = await (await phone(browser)).newPage()
    await guest.goto(url.replace(/^https?:\/\/[^/]+/, BASE))
    await hydrated(guest)
    await guest.getByRole('heading', { name: 'Join Larkspur Amp Works' }).waitFor()
    await guest.getByLabel('Your name').fill('Browser Invitee')
    await guest.getByLabel('Password').fill('long-enough-pw')
    await guest.getByRole('button', { name: 'Create account' }).click()
    await guest.waitForURL(`${BASE}/`)
    await guest.getByText('Larkspur Amp Works').first().waitFor()
    await context.close()
  })

  it('opens the Bench at /bench, where its tools live', async () => {
    const page = await pageAs(browser, 'tech@larkspur.example', '/bench')
    await page.waitForURL(`${BASE}/`)
    await page.getByRole('heading', { level: 1, name: 'Bench' }).waitFor()
    await page.getByRole('list', { name: 'Bench tools' }).getByRole('link', { name: /Idle dissipation/ }).click()
    await page.waitForURL(/\/bench\/idle-dissipation$/)
    await page.context().close()
  })
})
