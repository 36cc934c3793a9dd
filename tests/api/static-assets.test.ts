import { brotliDecompressSync, gunzipSync } from 'node:zlib'
import { describe, expect, it } from 'vitest'
import { BASE } from './helpers/client'

const shell = () => fetch(`${BASE}/`, { headers: { accept: 'text/html' } }).then(r => r.text())

describe('static assets', () => {
  it('sends each build file pre-compressed as the browser asks, and immutable for a year', async () => {
    const src = (await shell()).match(/src="(\/_nuxt\/[^"]+\.js)"/)?.[1]
    expect(src).toBeTruthy()
    const plain = await fetch(BASE + src, { headers: { 'accept-encoding': 'identity' } })
    const body = Buffer.from(await plain.arrayBuffer())
    expect(plain.headers.get('content-encoding')).toBeNull()
    for (const [encoding, inflate] of [['br', brotliDecompressSync], ['gzip', gunzipSync]] as const) {
      const res = await fetch(BASE + src, { headers: { 'accept-encoding': encoding } })
      expect(res.headers.get('content-encoding'), encoding).toBe(encoding)
      expect(res.headers.get('content-type')).toMatch(/javascript/)
      expect(res.headers.get('cache-control')).toBe('public, max-age=31536000, immutable')
      // fetch would undo the encoding itself; read the raw bytes to check them.
      const raw = await import('node:http').then(http => new Promise<Buffer>((resolve, reject) => {
        http.get(BASE + src, { headers: { 'accept-encoding': encoding } }, (r) => {
          const chunks: Buffer[] = []
          r.on('data', c => chunks.push(c)).on('end', () => resolve(Buffer.concat(chunks))).on('error', reject)
        }).on('error', reject)
      }))
      expect(raw.length).toBeLessThan(body.length)
      expect(inflate(raw).equals(body)).toBe(true)
    }
  })

  it('has the shell and the service worker checked on every load', async () => {
    for (const path of ['/', '/sw.js', '/manifest.webmanifest']) {
      const res = await fetch(BASE + path, { headers: { 'accept-encoding': 'br, gzip' } })
      expect(res.status, path).toBe(200)
      expect(res.headers.get('cache-control'), path).toBe('no-cache')
    }
  })
})
