import { createHash, randomBytes } from 'node:crypto'
import { existsSync, readdirSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { BASE, DEMO, client, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'

// Source: PNG signature, ISO/IEC 15948 section 5.2; JPEG SOI marker FFD8 then a marker (ITU-T T.81 B.1.1.3);
// WebP is a RIFF container with form type "WEBP" (WebP container specification).
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A])
const JPEG_START = Buffer.from([0xFF, 0xD8, 0xFF, 0xE0])
const webpStart = () => Buffer.concat([Buffer.from('RIFF'), Buffer.from([0x24, 0, 0, 0]), Buffer.from('WEBPVP8 ')])

// Random tails make every photo new to this server, so runs do not depend on each other.
const photo = (head: Buffer, size = 256) => Buffer.concat([head, randomBytes(size)])
const hashOf = (b: Buffer) => createHash('sha256').update(b).digest('hex')

async function put(c: Client | null, sha: string, body: Buffer, type: string) {
  const res = await fetch(`${BASE}/api/blobs/${sha}`, {
    method: 'PUT',
    headers: { 'content-type': type, ...(c?.cookie ? { cookie: c.cookie } : {}) },
    body,
  })
  return { status: res.status, body: await res.json().catch(() => null) as any }
}

async function get(c: Client | null, sha: string) {
  const res = await fetch(`${BASE}/api/blobs/${sha}`, { headers: c?.cookie ? { cookie: c.cookie } : {} })
  return { status: res.status, type: res.headers.get('content-type'), bytes: Buffer.from(await res.arrayBuffer()) }
}

const rowsFor = (sha: string) => sql<{ shop_id: string, size: number, type: string, created_by: string }>('SELECT shop_id, size, type, created_by FROM blobs WHERE sha256 = ?', [sha])

function filesOnDisk(sha: string) {
  const dir = process.env.TW_TEST_BLOB_DIR
  if (!dir) throw new Error('TW_TEST_BLOB_DIR is not set (run through npm test)')
  const sub = join(dir, sha.slice(0, 2))
  return existsSync(sub) ? readdirSync(sub).filter(f => f.startsWith(sha)) : []
}

describe('PUT /api/blobs/:sha256', () => {
  it('answers 401 to a signed-out upload and stores nothing', async () => {
    const body = photo(PNG_SIGNATURE)
    const sha = hashOf(body)
    expect((await put(client(), sha, body, 'image/png')).status).toBe(401)
    expect(await rowsFor(sha)).toHaveLength(0)
  })

  it('refuses a body whose hash is not the one in the path (400)', async () => {
    const tech = await login(DEMO.tech)
    const body = photo(PNG_SIGNATURE)
    const other = hashOf(photo(PNG_SIGNATURE))
    const r = await put(tech, other, body, 'image/png')
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/hash/)
    expect(await rowsFor(other)).toHaveLength(0)
    expect(await rowsFor(hashOf(body))).toHaveLength(0)
  })

  it('refuses a type that is not a photo, and bytes that do not match the claimed type (415)', async () => {
    const tech = await login(DEMO.tech)
    const text = Buffer.from(`not a photo ${Math.random()}`)
    expect((await put(tech, hashOf(text), text, 'text/plain')).status).toBe(415)
    // A GIF header sent as PNG: the header says PNG, the bytes do not.
    const gif = photo(Buffer.from('GIF89a'))
    expect((await put(tech, hashOf(gif), gif, 'image/png')).status).toBe(415)
    // A real PNG start sent as JPEG.
    const png = photo(PNG_SIGNATURE)
    expect((await put(tech, hashOf(png), png, 'image/jpeg')).status).toBe(415)
    expect(await rowsFor(hashOf(png))).toHaveLength(0)
  })

  it('refuses more than 8 MiB (413) and takes exactly 8 MiB', async () => {
    const tech = await login(DEMO.tech)
    const big = photo(PNG_SIGNATURE, 8 * 1024 * 1024 - PNG_SIGNATURE.length + 1)
    expect(big.length).toBe(8 * 1024 * 1024 + 1)
    expect((await put(tech, hashOf(big), big, 'image/png')).status).toBe(413)
    expect(await rowsFor(hashOf(big))).toHaveLength(0)
    const edge = big.subarray(0, 8 * 1024 * 1024)
    expect((await put(tech, hashOf(edge), edge, 'image/png')).status).toBe(201)
  })

  it('stores a new photo once (201) and answers 200 to the same bytes again', async () => {
    const tech = await login(DEMO.tech)
    const body = photo(JPEG_START, 4096)
    const sha = hashOf(body)
    const first = await put(tech, sha, body, 'image/jpeg')
    expect(first.status).toBe(201)
    expect(first.body).toMatchObject({ sha256: sha, type: 'image/jpeg', size: body.length, stored: true })
    const again = await put(tech, sha, body, 'image/jpeg; charset=binary')
    expect(again.status).toBe(200)
    expect(again.body.stored).toBe(false)
    const rows = await rowsFor(sha)
    expect(rows).toHaveLength(1)
    expect(rows[0]).toMatchObject({ shop_id: DEMO.shopId, size: body.length, type: 'image/jpeg' })
    expect(filesOnDisk(sha)).toEqual([sha])
  })

  it('answers five concurrent uploads of one photo with one 201 and one stored row', async () => {
    const tech = await login(DEMO.tech)
    const body = photo(webpStart(), 2048)
    const sha = hashOf(body)
    const statuses = (await Promise.all(Array.from({ length: 5 }, () => put(tech, sha, body, 'image/webp')))).map(r => r.status)
    expect(statuses.filter(s => s === 201)).toHaveLength(1)
    expect(statuses.filter(s => s === 200)).toHaveLength(4)
    expect(await rowsFor(sha)).toHaveLength(1)
    expect(filesOnDisk(sha)).toEqual([sha])
  })
})

describe('GET /api/blobs/:sha256', () => {
  it('serves the photo to another member of the shop, 404 to another shop, 401 signed out', async () => {
    const tech = await login(DEMO.tech)
    const body = photo(PNG_SIGNATURE, 1000)
    const sha = hashOf(body)
    expect((await put(tech, sha, body, 'image/png')).status).toBe(201)

    const owner = await login(DEMO.owner)
    const seen = await get(owner, sha)
    expect(seen.status).toBe(200)
    expect(seen.type).toBe('image/png')
    expect(seen.bytes.equals(body)).toBe(true)

    const stranger = await newOwner('blobs')
    expect((await get(stranger.c, sha)).status).toBe(404)
    expect((await get(client(), sha)).status).toBe(401)
    expect((await get(owner, 'f'.repeat(64))).status).toBe(404)
  })

  it('keeps shops apart when two upload the same bytes: each has its row, the file is stored once', async () => {
    const tech = await login(DEMO.tech)
    const stranger = await newOwner('blobs')
    const body = photo(PNG_SIGNATURE, 500)
    const sha = hashOf(body)
    expect((await put(stranger.c, sha, body, 'image/png')).status).toBe(201)
    expect((await get(tech, sha)).status).toBe(404)
    expect((await put(tech, sha, body, 'image/png')).status).toBe(201)
    expect((await get(tech, sha)).status).toBe(200)
    expect((await rowsFor(sha)).map(r => r.shop_id).sort()).toEqual([DEMO.shopId, stranger.shopId].sort())
    expect(filesOnDisk(sha)).toEqual([sha])
  })
})
