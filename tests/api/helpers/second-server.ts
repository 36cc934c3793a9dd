// A second app server on its own port (same build and env unless overridden), for tests that
// kill it or point it at a database that is down.
import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'

export const freePort = () => new Promise<number>((resolve) => {
  const s = createServer().listen(0, '127.0.0.1', () => {
    const p = (s.address() as { port: number }).port
    s.close(() => resolve(p))
  })
})

export async function secondServer(override: Record<string, string> = {}) {
  const env = { ...(JSON.parse(process.env.TW_TEST_APP_ENV ?? '{}') as Record<string, string>), ...override }
  const port = await freePort()
  const base = `http://localhost:${port}`
  let child: ChildProcess | null = null
  const start = async () => {
    child = spawn(process.execPath, ['.output/server/index.mjs'], {
      env: { ...process.env, ...env, PORT: String(port), NITRO_PORT: String(port), HOST: '127.0.0.1', NITRO_HOST: '127.0.0.1', NODE_ENV: 'production' },
      stdio: 'ignore',
    })
    for (let i = 0; i < 200; i++) {
      try {
        await fetch(`${base}/api/health`)
        return
      }
      catch { /* starting */ }
      await new Promise(r => setTimeout(r, 50))
    }
    throw new Error('second server did not start')
  }
  const kill = () => { (child as ChildProcess | null)?.kill('SIGKILL') }
  await start()
  return { base, start, kill }
}
