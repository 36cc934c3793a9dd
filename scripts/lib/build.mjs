// Rebuilds the app only when its sources changed since the last build.
import { createHash } from 'node:crypto'
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { execSync } from 'node:child_process'

const SOURCES = ['app', 'server', 'shared', 'public', 'nuxt.config.ts', 'tailwind.config.ts', 'pwa-assets.config.ts', 'package-lock.json']
const STAMP = '.output/.tubewright-build-hash'

function walk(path, files) {
  if (!existsSync(path)) return
  if (statSync(path).isDirectory()) {
    for (const entry of readdirSync(path).sort()) walk(join(path, entry), files)
  }
  else files.push(path)
}

export function sourceHash() {
  const files = []
  for (const s of SOURCES) walk(s, files)
  const h = createHash('sha256')
  for (const f of files) h.update(f).update('\0').update(readFileSync(f))
  return h.digest('hex')
}

export function ensureBuilt(log = console.log, { force = false } = {}) {
  const hash = sourceHash()
  if (!force && existsSync('.output/server/index.mjs') && existsSync(STAMP) && readFileSync(STAMP, 'utf8') === hash) {
    return false
  }
  log('Building the app (sources changed)...')
  execSync('npx nuxt build', { stdio: 'inherit', env: { ...process.env, NODE_ENV: 'production' } })
  writeFileSync(STAMP, hash)
  return true
}
