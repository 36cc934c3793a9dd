import { describe, expect, it } from 'vitest'
import type { BrowserContext, Page } from 'playwright-core'
import { apiLogin, BASE, browserForFile, hydrated, openWithServiceWorker, phone } from './helpers/browser'

const browser = browserForFile()

/** Every CSP refusal the page reports (the DOM event and the console line), and any script error. */
async function watched(context: BrowserContext) {
  await context.addInitScript(() => {
    const w = window as unknown as { __csp: string[] }
    w.__csp = []
    document.addEventListener('securitypolicyviolation', (e) => {
      w.__csp.push(`${e.violatedDirective} blocked ${e.blockedURI || 'inline'} (${e.sourceFile}:${e.lineNumber})`)
    })
  })
  const page = await context.newPage()
  const problems: string[] = []
  page.on('pageerror', e => problems.push(`page error: ${e.message}`))
  page.on('console', (m) => {
    if (m.type() === 'error' && /Content Security Policy|Refused to/i.test(m.text())) problems.push(`console: ${m.text()}`)
  })
  return { page, problems }
}

const violations = (page: Page) => page.evaluate(() => (window as unknown as { __csp?: string[] }).__csp ?? [])

async function visit(page: Page, path: string, heading: RegExp | string) {
  await page.goto(`${BASE}${path}`)
  await hydrated(page).catch((e: Error) => {
    throw new Error(`${path} did not start: ${e.message}`)
  })
  await page.getByRole('heading', { name: heading }).first().waitFor({ timeout: 20_000 })
  // Let late chunks, fonts and images load before reading the reports.
  await page.waitForLoadState('networkidle').catch(() => {})
  return violations(page)
}

describe('the app under its content-security-policy', () => {
  it('opens the main screens with no CSP violation and no script error', async () => {
    const context = await phone(browser)
    const { page, problems } = await watched(context)
    const seen: Record<string, string[]> = {}
    seen['/signin'] = await visit(page, '/signin', /sign in/i)
    // No wait for the service worker: its precache fetch of / leaves a copy in the HTTP cache, so
    // the next visit to / is a 304, which must not replace the policy that holds the shell's hashes.
    seen['/pay (invalid link)'] = await visit(page, '/pay/not-a-real-token-0123456789abcdef', /./)

    await apiLogin(page, 'desk@larkspur.example')
    const jobs = await page.request.get(`${BASE}/api/jobs`)
    const jobId = (await jobs.json()).items[0].id as string
    for (const [path, heading] of [
      ['/', /./],
      ['/bench/idle-dissipation', /dissipation/i],
      ['/jobs', /jobs/i],
      [`/jobs/${jobId}`, /./],
      ['/rigs', /rigs/i],
      ['/tubes', /tubes/i],
      ['/shop', /shop|larkspur/i],
      ['/account', /account/i],
    ] as const) {
      seen[path] = await visit(page, path, heading)
    }
    // The fonts are the bundled ones, really in use.
    expect(await page.evaluate(() => document.fonts.check('16px Inter'))).toBe(true)
    for (const [path, list] of Object.entries(seen)) expect(list, path).toEqual([])
    expect(problems).toEqual([])
    // The watch works: a script written into the page is refused and reported.
    await page.evaluate(() => {
      const s = document.createElement('script')
      s.textContent = 'document.title = "inline ran"'
      document.body.append(s)
    })
    await expect.poll(() => violations(page)).toEqual([expect.stringMatching(/^script-src/)])
    expect(await page.title()).not.toBe('inline ran')
    await context.close()
  })

  it('installs the service worker and reloads with no network, still with no violation', async () => {
    const context = await phone(browser)
    const { page, problems } = await watched(context)
    await apiLogin(page, 'tech@larkspur.example')
    expect(await openWithServiceWorker(page, '/jobs')).toBe(true)
    expect(await violations(page)).toEqual([])
    await context.setOffline(true)
    await page.reload()
    await hydrated(page)
    await page.getByRole('heading', { name: /jobs/i }).first().waitFor()
    expect(await page.evaluate(() => navigator.onLine)).toBe(false)
    expect(await violations(page)).toEqual([])
    // The document served by the service worker still carries the policy.
    const policy = await page.evaluate(async () => (await fetch('/', { cache: 'force-cache' })).headers.get('content-security-policy'))
    expect(policy).toContain(`frame-ancestors 'none'`)
    expect(problems).toEqual([])
    await context.close()
  })
})
