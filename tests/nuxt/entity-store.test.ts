// The entity-store factory over the on-device database (fake-indexeddb), with no server reachable.
import { beforeEach, describe, expect, it } from 'vitest'
import { SHOP_ID } from './helpers/device'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { defineEntityStore, EntityInvalidError, oldestFirst } from '~/composables/useEntityTable'
import { useCustomersStore } from '~/stores/customers'

const useParts = defineEntityStore('jobParts', { id: 'test-entity-parts', noun: 'part', order: oldestFirst })

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

async function outbox() {
  const sync = useSyncStore()
  return (await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')).map(m => ({ name: m.name, args: m.args, baseVersion: m.baseVersion }))
}

describe('defineEntityStore', () => {
  it('creates a record checked by the record schema, with defaults, and lists it for its job in order', async () => {
    await offlineShop('tech')
    const jobId = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo', serial: 'LW-6V6-0142', complaint: 'Hum' })
    const parts = useParts()
    const first = await parts.create({ jobId, description: 'Bias trim pot', quantity: 1, unitPriceCents: 425 })
    const second = await parts.create({ jobId, description: 'Matched pair 6V6GT', quantity: 2, unitPriceCents: 1850 })
    await until(() => parts.forJob(jobId).length === 2, 'both parts')
    expect(parts.forJob(jobId).map(p => p.id)).toEqual([first, second])
    expect(parts.forJob(crypto.randomUUID())).toEqual([])
    // The default the schema gives a part without a cost.
    expect(parts.byId(first)?.unitCostCents).toBe(0)
    expect(parts.byId(null)).toBeUndefined()
    const queued = (await outbox()).filter(m => m.name === 'jobPart.create')
    expect(queued.map(m => m.args.id)).toEqual([first, second])
    expect(queued[0]!.args).toMatchObject({ jobId, description: 'Bias trim pot', quantity: 1, unitCostCents: 0, unitPriceCents: 425 })
  })

  it('refuses a create the schema refuses, naming each field, and queues nothing', async () => {
    await offlineShop('tech')
    const jobId = await seedJob({ customer: 'Sam Okafor', amp: 'four-6L6 head', serial: 'LW-6L6-0007', complaint: 'No sound' })
    const before = (await outbox()).length
    const parts = useParts()
    const err = await parts.create({ jobId, description: '  ', quantity: 0, unitPriceCents: 12.5 }).catch((e: unknown) => e)
    expect(err).toBeInstanceOf(EntityInvalidError)
    const fields = (err as EntityInvalidError).fields
    expect(fields.description).toBe('describe the part')
    expect(Object.keys(fields).sort()).toEqual(['description', 'quantity', 'unitPriceCents'])
    expect(fields.unitPriceCents).toBe('must be whole cents')
    expect(await outbox()).toHaveLength(before)
  })

  it('edits only the fields that changed, from the version the device saw, and says when nothing did', async () => {
    await offlineShop('owner')
    const customers = useCustomersStore()
    const id = await customers.create({ name: 'Rhea Vance', phone: '555-0142' })
    await until(() => !!customers.byId(id), 'the customer')
    expect(await customers.edit(id, { name: 'Rhea Vance', phone: '555-0199' })).toBe(true)
    const edits = (await outbox()).filter(m => m.name === 'customer.setFields')
    expect(edits).toEqual([{ name: 'customer.setFields', args: { id, fields: { phone: '555-0199' } }, baseVersion: 0 }])
    await until(() => customers.byId(id)?.phone === '555-0199', 'the new phone number')
    expect(await customers.edit(id, { phone: '555-0199' })).toBe(false)
    await expect(customers.edit(id, { email: 'not an address' })).rejects.toThrow('enter a valid e-mail address')
    await expect(customers.edit(crypto.randomUUID(), { name: 'X' })).rejects.toThrow('That customer is not on this device.')
    expect((await outbox()).filter(m => m.name === 'customer.setFields')).toHaveLength(1)
  })

  it('removes a record from the lists and restores it', async () => {
    await offlineShop('tech')
    const jobId = await seedJob({ customer: 'Ada Brook', amp: 'two-EL84 combo', serial: 'LW-EL84-0031', complaint: 'Crackle' })
    const parts = useParts()
    const id = await parts.create({ jobId, description: 'Screen resistor', quantity: 2, unitPriceCents: 90 })
    await until(() => parts.forJob(jobId).length === 1, 'the part')
    await parts.remove(id)
    await until(() => parts.forJob(jobId).length === 0, 'the part to go')
    expect(parts.byId(id)).toBeUndefined()
    // Still on the device, marked deleted, so it can come back.
    expect((await useSyncStore().db!.jobParts.get(id))?.deleted).toBe(true)
    await parts.restore(id)
    await until(() => parts.forJob(jobId).length === 1, 'the part to come back')
    expect(parts.byId(id)?.description).toBe('Screen resistor')
    const names = (await outbox()).filter(m => m.args.id === id).map(m => m.name)
    expect(names).toEqual(['jobPart.create', 'jobPart.delete', 'jobPart.restore'])
    await expect(parts.restore(crypto.randomUUID())).rejects.toThrow('That part is not on this device.')
  })
})
