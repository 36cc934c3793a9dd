import { createHash, randomBytes } from 'node:crypto'
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Readable } from 'node:stream'
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3'
import S3rver from 's3rver'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createS3BlobStore } from '../../server/utils/blob-drivers/s3'
import { DEMO, client, login } from './helpers/client'
import { secondServer } from './helpers/second-server'

// Source: PNG signature, ISO/IEC 15948 section 5.2.
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A])
const photo = (size = 512) => Buffer.concat([PNG_SIGNATURE, randomBytes(size)])
const hashOf = (b: Buffer) => createHash('sha256').update(b).digest('hex')
// The fake's fixed credentials (s3rver documents S3RVER / S3RVER).
const KEYS = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' }
const BUCKET = 'tubewright-photos'

async function bytesOf(stream: Readable | null) {
  if (!stream) return null
  const chunks: Buffer[] = []
  for await (const c of stream) chunks.push(c as Buffer)
  return Buffer.concat(chunks)
}

let fake: S3rver
let endpoint = ''
let dir = ''
let s3: S3Client
const keysIn = async (prefix = '') => ((await s3.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: prefix }))).Contents ?? []).map(o => o.Key)

beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), 'tubewright-s3-'))
  fake = new S3rver({ port: 0, address: '127.0.0.1', silent: true, directory: join(dir, 'bucket'), configureBuckets: [{ name: BUCKET, configs: [] }] })
  const { port } = await fake.run() as unknown as { port: number }
  endpoint = `http://127.0.0.1:${port}`
  s3 = new S3Client({ region: 'us-east-1', endpoint, forcePathStyle: true, credentials: KEYS })
})

afterAll(async () => {
  s3?.destroy()
  await fake?.close()
  rmSync(dir, { recursive: true, force: true })
})

describe('S3 photo store (driver)', () => {
  const store = () => createS3BlobStore({ bucket: BUCKET, region: 'us-east-1', endpoint, forcePathStyle: true, prefix: 'driver/', ...KEYS })

  it('stores under prefix/ab/<sha256>, reads the same bytes back and knows what it holds', async () => {
    const body = photo()
    const sha = hashOf(body)
    expect(await store().has(sha)).toBe(false)
    expect(await store().get(sha)).toBeNull()
    await store().put(sha, body, 'image/png')
    expect(await store().has(sha)).toBe(true)
    expect((await bytesOf(await store().get(sha)))!.equals(body)).toBe(true)
    expect(await keysIn(`driver/${sha.slice(0, 2)}/`)).toEqual([`driver/${sha.slice(0, 2)}/${sha}`])
  })

  it('keeps one object when the same hash is stored again, also at once', async () => {
    const body = photo(2048)
    const sha = hashOf(body)
    await Promise.all([1, 2, 3].map(() => store().put(sha, body, 'image/png')))
    await store().put(sha, body, 'image/png')
    expect(await keysIn(`driver/${sha.slice(0, 2)}/${sha}`)).toHaveLength(1)
    expect((await bytesOf(await store().get(sha)))!.equals(body)).toBe(true)
  })

  it('refuses to start without a bucket', () => {
    expect(() => createS3BlobStore({ bucket: '', region: 'us-east-1' })).toThrow(/bucket/)
  })
})

describe('two app servers sharing one S3 bucket', () => {
  it('a photo uploaded to one server is served by the other; neither writes the local folder', async () => {
    const localDir = join(dir, 'local-blobs')
    const env = {
      NUXT_BLOB_DRIVER: 's3', NUXT_BLOB_DIR: localDir, NUXT_S3_BUCKET: BUCKET, NUXT_S3_ENDPOINT: endpoint,
      NUXT_S3_FORCE_PATH_STYLE: 'true', NUXT_S3_PREFIX: 'app/', NUXT_S3_ACCESS_KEY_ID: KEYS.accessKeyId, NUXT_S3_SECRET_ACCESS_KEY: KEYS.secretAccessKey,
    }
    const [a, b] = await Promise.all([secondServer(env), secondServer(env)])
    try {
      // Sealed-cookie sessions: the cookie from one server is good on the other.
      const tech = await login(DEMO.tech)
      const onA = client(a.base, tech.cookie)
      const onB = client(b.base, tech.cookie)
      const body = photo(4096)
      const sha = hashOf(body)
      const put = await fetch(`${a.base}/api/blobs/${sha}`, { method: 'PUT', headers: { 'content-type': 'image/png', 'cookie': onA.cookie }, body })
      expect(put.status).toBe(201)
      expect(await keysIn(`app/${sha.slice(0, 2)}/`)).toEqual([`app/${sha.slice(0, 2)}/${sha}`])

      const got = await fetch(`${b.base}/api/blobs/${sha}`, { headers: { cookie: onB.cookie } })
      expect(got.status).toBe(200)
      expect(got.headers.get('content-type')).toBe('image/png')
      expect(Buffer.from(await got.arrayBuffer()).equals(body)).toBe(true)

      const again = await fetch(`${b.base}/api/blobs/${sha}`, { method: 'PUT', headers: { 'content-type': 'image/png', 'cookie': onB.cookie }, body })
      expect(again.status).toBe(200)
      expect(await keysIn(`app/${sha.slice(0, 2)}/${sha}`)).toHaveLength(1)
      expect(existsSync(localDir) ? readdirSync(localDir) : []).toEqual([])
      // A hash the bucket does not hold is still 404, and a stranger still gets nothing.
      expect((await fetch(`${b.base}/api/blobs/${'e'.repeat(64)}`, { headers: { cookie: onB.cookie } })).status).toBe(404)
      expect((await fetch(`${b.base}/api/blobs/${sha}`)).status).toBe(401)
    }
    finally {
      a.kill()
      b.kill()
    }
  }, 120_000)
})
