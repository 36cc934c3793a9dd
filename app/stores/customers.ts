import { defineStore } from 'pinia'
import type { EntityFields } from '#shared/utils/sync/entities'
import { matchesText } from '~/stores/notes'
import { validateCreate } from '~/utils/jobs/check-in'

export type CustomerInput = Partial<EntityFields<'customers'>>

/** The shop's customers, on the device; created and edited offline through the outbox. */
export const useCustomersStore = defineStore('customers', () => {
  const sync = useSyncStore()
  const rows = useShopTable('customers').list
  const all = computed(() => [...rows.value].sort((a, b) => a.name.localeCompare(b.name)))
  const byId = (id: string | null | undefined) => (id ? rows.value.find(c => c.id === id) : undefined)
  const search = (q: string) => all.value.filter(c => matchesText(q, c.name, c.email, c.phone))
  /** The customer records linked to a player's account. */
  const forPlayer = (userId: string) => rows.value.filter(c => c.playerUserId === userId)

  async function create(fields: CustomerInput): Promise<string> {
    const v = validateCreate('customers', fields)
    if (!v.ok) throw new Error(Object.values(v.errors)[0])
    const id = crypto.randomUUID()
    await sync.mutate('customer.create', { id, ...v.value })
    return id
  }

  async function edit(id: string, fields: CustomerInput) {
    const row = await sync.db?.customers.get(id)
    if (!row) throw new Error('That customer is not on this device.')
    const changed = changedFields(row, fields)
    if (!Object.keys(changed).length) return false
    await sync.mutate('customer.setFields', { id, fields: changed }, row.version)
    return true
  }

  return { all, byId, search, forPlayer, create, edit }
})
