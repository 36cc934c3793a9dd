import { randomUUID } from 'node:crypto'
import { createReadStream, existsSync } from 'node:fs'
import { mkdir, rename, writeFile } from 'node:fs/promises'
import { dirname, join, resolve } from 'node:path'
import { blobKey, type BlobStore } from './types'

/** Files under one folder on this machine: the default, for a shop on one server. */
export function createLocalBlobStore(dir: string): BlobStore {
  const root = resolve(dir)
  const pathOf = (sha256: string) => join(root, blobKey(sha256))
  return {
    driver: 'local',
    has: async sha256 => existsSync(pathOf(sha256)),
    async put(sha256, body) {
      const path = pathOf(sha256)
      if (existsSync(path)) return
      await mkdir(dirname(path), { recursive: true })
      // Written aside and renamed, so a reader never sees half a photo.
      const tmp = `${path}.${randomUUID()}.tmp`
      await writeFile(tmp, body)
      await rename(tmp, path)
    },
    get: async sha256 => existsSync(pathOf(sha256)) ? createReadStream(pathOf(sha256)) : null,
  }
}
