import { randomUUID } from 'node:crypto'
import { SYNC_SCHEMA_VERSION } from '../../../shared/utils/sync/protocol'
import type { Client } from './client'

export interface PushResult { id: number, status: string, reason?: string }

// One device per person and space, as in the app: its own client id and mutation numbers.
const devices = new WeakMap<Client, Map<string, { clientId: string, next: number }>>()

/** Push `changes` from this person's device for the space `shopId`; the raw answer. */
export async function pushFromDevice(c: Client, shopId: string, changes: { name: string, args: unknown }[]) {
  const mine = devices.get(c) ?? new Map<string, { clientId: string, next: number }>()
  devices.set(c, mine)
  const d = mine.get(shopId) ?? { clientId: randomUUID(), next: 1 }
  mine.set(shopId, d)
  return c.post('/api/sync/push', {
    clientId: d.clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION,
    mutations: changes.map(m => ({ id: d.next++, uuid: randomUUID(), ...m })),
  })
}

export const statuses = (rs: PushResult[]) => rs.map(r => r.status)
