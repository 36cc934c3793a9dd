// Installs dependencies when node_modules is missing or older than package-lock.json.
import { execSync } from 'node:child_process'
import { existsSync, statSync } from 'node:fs'

export function dependenciesStale(root = '.') {
  const marker = `${root}/node_modules/.package-lock.json`
  if (!existsSync(marker)) return true
  const lock = `${root}/package-lock.json`
  return existsSync(lock) && statSync(lock).mtimeMs > statSync(marker).mtimeMs + 1000
}

export function ensureDependencies(log = console.log) {
  if (!dependenciesStale()) return false
  log('Installing dependencies (npm ci)...')
  execSync(existsSync('package-lock.json') ? 'npm ci --no-audit --no-fund' : 'npm install --no-audit --no-fund', { stdio: 'inherit' })
  return true
}
