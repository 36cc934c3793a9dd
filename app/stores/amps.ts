import { defineStore } from 'pinia'
import type { EntityFields } from '#shared/utils/sync/entities'
import { validateCreate } from '~/utils/jobs/check-in'

export type AmpInput = Partial<EntityFields<'amps'>>

/** Customers' amps, on the device. */
export const useAmpsStore = defineStore('amps', () => {
  const sync = useSyncStore()
  const rows = useShopTable('amps').list
  const byId = (id: string | null | undefined) => (id ? rows.value.find(a => a.id === id) : undefined)
  const forCustomer = (customerId: string) => rows.value.filter(a => a.customerId === customerId)
  const bySerial = (q: string) => {
    const s = q.trim().toLowerCase()
    return s ? rows.value.filter(a => a.serial.toLowerCase().includes(s)) : []
  }

  async function create(fields: AmpInput): Promise<string> {
    const v = validateCreate('amps', fields)
    if (!v.ok) throw new Error(Object.values(v.errors)[0])
    const id = crypto.randomUUID()
    await sync.mutate('amp.create', { id, ...v.value })
    return id
  }

  async function edit(id: string, fields: AmpInput) {
    const row = await sync.db?.amps.get(id)
    if (!row) throw new Error('That amp is not on this device.')
    const changed = changedFields(row, fields)
    if (!Object.keys(changed).length) return false
    await sync.mutate('amp.setFields', { id, fields: changed }, row.version)
    return true
  }

  return { all: rows, byId, forCustomer, bySerial, create, edit }
})
