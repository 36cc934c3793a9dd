// Jobs made on the device (the sync server is down, so everything stays local) for component tests.
import { flushPromises } from '@vue/test-utils'
import type { JobState } from '#shared/utils/jobs/states'
import { fakeSyncServer, signInLocally } from './device'
import { useSyncStore } from '~/stores/sync'
import { useCustomersStore } from '~/stores/customers'
import { useAmpsStore } from '~/stores/amps'
import { useJobsStore } from '~/stores/jobs'

export async function until(check: () => boolean, what: string) {
  for (let i = 0; i < 300; i++) {
    await flushPromises()
    if (check()) return
    await new Promise(r => setTimeout(r, 10))
  }
  throw new Error(`timed out waiting for ${what}`)
}

/** Signs in on the device with a fresh database and no reachable server. */
export async function offlineShop(role: 'tech' | 'owner' | 'player' = 'owner') {
  const server = fakeSyncServer()
  server.mode = 'down'
  const user = signInLocally(role)
  const sync = useSyncStore()
  await until(() => !!sync.engine, 'the engine to start')
  return { server, user, sync }
}

export interface SeedJob { customer: string, amp: string, serial: string, complaint: string, status?: JobState, promisedFor?: string, assignedTo?: string | null }

/** Creates customer, amp and job through the stores, then moves the job along allowed steps to `status`. */
export async function seedJob(s: SeedJob) {
  const customerId = await useCustomersStore().create({ name: s.customer })
  const ampId = await useAmpsStore().create({ customerId, description: s.amp, serial: s.serial })
  const jobs = useJobsStore()
  const id = await jobs.create({ customerId, ampId, complaint: s.complaint, promisedFor: s.promisedFor ?? '', assignedTo: s.assignedTo ?? null })
  const path: Partial<Record<JobState, JobState[]>> = {
    'on-bench': ['on-bench'],
    'waiting-parts': ['on-bench', 'waiting-parts'],
    'ready': ['on-bench', 'ready'],
    'handed-back': ['on-bench', 'ready', 'handed-back'],
    'cancelled': ['cancelled'],
  }
  for (const step of path[s.status ?? 'checked-in'] ?? []) await jobs.move(id, step)
  return id
}
