import type { EntityFields } from '#shared/utils/sync/entities'

export type AmpInput = Partial<EntityFields<'amps'>>

/** Customers' amps, on the device. */
export const useAmpsStore = defineEntityStore('amps', { noun: 'amp' }, ({ all }) => ({
  forCustomer: (customerId: string) => all.value.filter(a => a.customerId === customerId),
  bySerial: (q: string) => {
    const s = q.trim().toLowerCase()
    return s ? all.value.filter(a => a.serial.toLowerCase().includes(s)) : []
  },
}))
