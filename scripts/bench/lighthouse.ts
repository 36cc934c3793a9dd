// Mobile Lighthouse (its default form factor: simulated slow 4G, 4x CPU slowdown) through the
// lighthouse npm package's CLI, driving Debian chromium in a fresh profile for every run.
import { execFile } from 'node:child_process'
import { promisify } from 'node:util'
import { CHROMIUM, CHROMIUM_FLAGS } from './browser'
import { median } from './report'

const run = promisify(execFile)

export interface LighthouseFigures { performance: number, accessibility: number, tbt: number, lcp: number }

async function once(url: string, cookie?: string): Promise<LighthouseFigures> {
  const args = [
    'node_modules/lighthouse/cli/index.js', url,
    '--output=json', '--output-path=stdout', '--quiet',
    '--only-categories=performance,accessibility',
    `--chrome-flags=--headless=new ${CHROMIUM_FLAGS.join(' ')}`,
  ]
  if (cookie) args.push(`--extra-headers=${JSON.stringify({ Cookie: cookie })}`)
  const { stdout } = await run(process.execPath, args, { env: { ...process.env, CHROME_PATH: CHROMIUM }, maxBuffer: 256 * 1024 * 1024 })
  const lhr = JSON.parse(stdout)
  if (lhr.runtimeError) throw new Error(`lighthouse ${url}: ${lhr.runtimeError.message}`)
  return {
    performance: Math.round(lhr.categories.performance.score * 100),
    accessibility: Math.round(lhr.categories.accessibility.score * 100),
    tbt: lhr.audits['total-blocking-time'].numericValue,
    lcp: lhr.audits['largest-contentful-paint'].numericValue,
  }
}

/** The median of `runs` runs, figure by figure (Lighthouse varies from run to run). */
export async function lighthouse(url: string, cookie: string | undefined, runs: number): Promise<LighthouseFigures> {
  const all: LighthouseFigures[] = []
  for (let i = 0; i < runs; i++) all.push(await once(url, cookie))
  return {
    performance: median(all.map(r => r.performance)),
    accessibility: median(all.map(r => r.accessibility)),
    tbt: median(all.map(r => r.tbt)),
    lcp: median(all.map(r => r.lcp)),
  }
}
