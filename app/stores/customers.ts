import type { EntityFields } from '#shared/utils/sync/entities'
import { matchesText } from '~/stores/notes'

export type CustomerInput = Partial<EntityFields<'customers'>>

/** The shop's customers, on the device; created and edited offline through the outbox. */
export const useCustomersStore = defineEntityStore('customers', { noun: 'customer', order: (a, b) => a.name.localeCompare(b.name) }, ({ all }) => ({
  search: (q: string) => all.value.filter(c => matchesText(q, c.name, c.email, c.phone)),
  /** The customer records linked to a player's account. */
  forPlayer: (userId: string) => all.value.filter(c => c.playerUserId === userId),
}))
