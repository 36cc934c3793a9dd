// The bare reference: a one-page Nuxt app with the PWA module (scripts/bench/bare), built in this
// run with the project's own node_modules and served by its own Nitro server.
import { execSync, spawn } from 'node:child_process'
import { setTimeout as sleep } from 'node:timers/promises'
import { freePort } from '../lib/stack.mjs'

export async function startBare() {
  execSync('npx nuxt build scripts/bench/bare', { stdio: ['ignore', 'ignore', 'inherit'], env: { ...process.env, NODE_ENV: 'production' } })
  const port = await freePort()
  const child = spawn(process.execPath, ['scripts/bench/bare/.output/server/index.mjs'], {
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NODE_ENV: 'production' },
    stdio: 'ignore',
  })
  const url = `http://localhost:${port}`
  for (let i = 0; i < 150; i++) {
    try {
      if ((await fetch(url)).ok) return { url, stop: () => child.kill('SIGTERM') }
    }
    catch { /* not up yet */ }
    await sleep(200)
  }
  child.kill('SIGTERM')
  throw new Error('The bare reference server did not answer.')
}
