import { createHash, randomBytes } from 'node:crypto'
import { existsSync, readdirSync } from 'node:fs'
import { request } from 'node:http'
import { dirname } from 'node:path'
import { beforeAll, describe, expect, it } from 'vitest'
import { BASE, DEMO, login, type Client } from './helpers/client'
import { sql } from './helpers/db'

// Source: PNG signature, ISO/IEC 15948 section 5.2.
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A])
const hashOf = (b: Buffer) => createHash('sha256').update(b).digest('hex')

/** A request whose path is sent exactly as written: fetch would resolve `..` and %2e%2e itself. */
function rawPut(path: string, body: Buffer, headers: Record<string, string | number>) {
  const url = new URL(BASE)
  return new Promise<{ status: number, body: string }>((resolve, reject) => {
    const req = request({ host: url.hostname, port: url.port, method: 'PUT', path, headers }, (res) => {
      let text = ''
      res.setEncoding('utf8')
      res.on('data', (c: string) => (text += c))
      res.on('end', () => resolve({ status: res.statusCode!, body: text }))
    })
    req.on('error', reject)
    req.end(body)
  })
}

let tech: Client
const blobDir = () => process.env.TW_TEST_BLOB_DIR!
const listing = (dir: string) => (existsSync(dir) ? readdirSync(dir).sort() : [])

beforeAll(async () => {
  tech = await login(DEMO.tech)
})

describe('photo uploads refuse path tricks', () => {
  it('answers 400 or 404 for anything but a 64-hex sha256, and writes nothing outside the blob folder', async () => {
    // A first photo under its own name is accepted (and makes sure the blob folder exists).
    const first = Buffer.concat([PNG_SIGNATURE, randomBytes(64)])
    const ok = await rawPut(`/api/blobs/${hashOf(first)}`, first, { 'content-type': 'image/png', 'content-length': first.length, 'cookie': tech.cookie })
    expect(ok.status).toBe(201)
    const body = Buffer.concat([PNG_SIGNATURE, randomBytes(64)])
    const sha = hashOf(body)
    const parent = dirname(blobDir())
    const before = listing(parent)
    const tricks = [
      `/api/blobs/..%2F..%2Fevil`,
      `/api/blobs/%2e%2e%2f%2e%2e%2fevil`,
      `/api/blobs/..%5C..%5Cevil`,
      `/api/blobs/../../evil`,
      `/api/blobs/${sha.slice(0, 62)}%2F..`,
      `/api/blobs/${sha.toUpperCase()}`,
      `/api/blobs/${sha}x`,
      `/api/blobs/${sha.slice(0, 63)}`,
      `/api/blobs/${sha.slice(0, 60)}%00abc`,
      `/api/blobs/${sha}%2F..%2F..%2Fevil`,
      `/api/blobs/%2Fetc%2Fpasswd`,
    ]
    for (const path of tricks) {
      const r = await rawPut(path, body, { 'content-type': 'image/png', 'content-length': body.length, 'cookie': tech.cookie })
      expect([400, 404], `${path} answered ${r.status}`).toContain(r.status)
      expect(r.body).not.toMatch(/ENOENT|EACCES|at \w+ \(/)
    }
    expect(listing(parent)).toEqual(before)
    expect(listing(blobDir()).some(f => f.includes('evil'))).toBe(false)
    expect(await sql('select sha256 from blobs where sha256 = ?', [sha])).toHaveLength(0)
  })
})

describe('photo uploads refuse wrong types and sizes', () => {
  it('looks at the bytes, not the header: SVG, HTML and a script sent as photos are refused (415)', async () => {
    const fakes: [string, Buffer][] = [
      ['image/png', Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg> ${Math.random()}`)],
      ['image/jpeg', Buffer.from(`<!doctype html><script>alert(1)</script> ${Math.random()}`)],
      ['image/webp', Buffer.from(`RIFF\u0000\u0000\u0000\u0000WAVEfmt ${Math.random()}`)],
      ['image/svg+xml', Buffer.from(`<svg xmlns="http://www.w3.org/2000/svg"/> ${Math.random()}`)],
      ['application/octet-stream', Buffer.concat([PNG_SIGNATURE, randomBytes(32)])],
    ]
    for (const [type, body] of fakes) {
      const r = await rawPut(`/api/blobs/${hashOf(body)}`, body, { 'content-type': type, 'content-length': body.length, 'cookie': tech.cookie })
      expect(r.status, type).toBe(415)
      expect(await sql('select sha256 from blobs where sha256 = ?', [hashOf(body)])).toHaveLength(0)
    }
  })

  it('refuses an announced size over the limit before reading the body (413), and a body with no length (411)', async () => {
    const body = Buffer.concat([PNG_SIGNATURE, randomBytes(32)])
    // Only the header claims 9 MiB; the server answers without waiting for the rest.
    const big = await new Promise<number>((resolve, reject) => {
      const url = new URL(BASE)
      const req = request({ host: url.hostname, port: url.port, method: 'PUT', path: `/api/blobs/${hashOf(body)}`, headers: { 'content-type': 'image/png', 'content-length': 9 * 1024 * 1024, 'cookie': tech.cookie } }, (res) => {
        res.resume()
        resolve(res.statusCode!)
        req.destroy()
      })
      req.on('error', reject)
      req.write(body)
    })
    expect(big).toBe(413)
    const chunked = await rawPut(`/api/blobs/${hashOf(body)}`, body, { 'content-type': 'image/png', 'transfer-encoding': 'chunked', 'cookie': tech.cookie })
    expect(chunked.status).toBe(411)
  })
})
