// Runs the built Nitro server as a child process and waits until it answers.
import { spawn } from 'node:child_process'
import { setTimeout as sleep } from 'node:timers/promises'

export async function startAppServer({ port, env, stdio = 'inherit' }) {
  const child = spawn(process.execPath, ['.output/server/index.mjs'], {
    env: { ...process.env, ...env, PORT: String(port), NITRO_PORT: String(port), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', NODE_ENV: 'production' },
    stdio,
  })
  const url = `http://localhost:${port}`
  const deadline = Date.now() + 60_000
  for (;;) {
    if (child.exitCode !== null) throw new Error(`The app server exited with code ${child.exitCode}.`)
    try {
      const r = await fetch(`${url}/api/health`)
      if (r.ok) break
    }
    catch { /* not up yet */ }
    if (Date.now() > deadline) throw new Error('The app server did not answer within 60 s.')
    await sleep(200)
  }
  return { child, url }
}
