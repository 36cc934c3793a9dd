// npm test: lint, typecheck, then every test suite against a throwaway MariaDB and the built app.
import { ensureDependencies } from './lib/deps.mjs'

const log = msg => console.log(`[test] ${msg}`)
ensureDependencies(log)

const { execSync, spawn, spawnSync } = await import('node:child_process')
const { existsSync, mkdtempSync, readFileSync, rmSync } = await import('node:fs')
const { tmpdir } = await import('node:os')
const { join } = await import('node:path')
const { startThrowawayStack } = await import('./lib/stack.mjs')

// Async: the SMTP catcher lives in this process and must keep answering while tests run.
const run = (cmd, opts) => new Promise((resolve) => {
  const child = spawn(cmd, { shell: true, stdio: 'inherit', ...opts })
  child.on('exit', status => resolve({ status }))
})

function step(name, cmd) {
  log(name)
  const r = spawnSync(cmd, { shell: true, stdio: 'inherit' })
  if (r.status !== 0) throw new Error(`${name} failed`)
}

function ensureChromium() {
  if (existsSync('/usr/bin/chromium')) return
  if (process.getuid?.() !== 0) throw new Error('Chromium is missing: install it with sudo apt-get install -y chromium')
  log('Installing Debian chromium for browser tests (one time)...')
  execSync('apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium', { stdio: 'inherit' })
}

// Arguments: suite names (unit, nuxt, api, e2e) and/or test file paths, e.g. `api tests/api/procedures.test.ts`.
const onlySuites = process.argv.slice(2).filter(a => !a.includes('/'))
const onlyFiles = process.argv.slice(2).filter(a => a.includes('/'))
const skipChecks = process.env.TW_SKIP_CHECKS === '1'
const reportDir = mkdtempSync(join(tmpdir(), 'tubewright-report-'))
let stack = null
let exitCode
try {
  if (!skipChecks) {
    step('lint', 'npx eslint .')
    step('typecheck', 'npx nuxt typecheck')
  }
  ensureChromium()
  stack = await startThrowawayStack({ log })

  const report = join(reportDir, 'vitest.json')
  const projects = [...onlySuites.map(s => `--project ${s}`), ...onlyFiles].join(' ')
  const r = await run(`npx vitest run ${projects} --reporter=default --reporter=json --outputFile.json=${report}`, {
    env: { ...process.env, ...stack.testEnv },
  })
  if (existsSync(report)) {
    const j = JSON.parse(readFileSync(report, 'utf8'))
    console.log(`\ntests: ${j.numPassedTests} passed, ${j.numFailedTests} failed`)
    exitCode = r.status === 0 && j.numFailedTests === 0 && j.numPassedTests > 0 ? 0 : 1
  }
  else {
    exitCode = r.status || 1
  }
}
catch (e) {
  console.error(`[test] ${e.message}`)
  exitCode = 1
}
finally {
  if (stack) await stack.stop()
  rmSync(reportDir, { recursive: true, force: true })
}
process.exit(exitCode)
