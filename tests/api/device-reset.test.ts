import { describe, expect, it } from 'vitest'
import { device } from './helpers/devices'
import { newOwner } from './helpers/client'

async function shopWithTech() {
  const shop = await newOwner('reset-shop')
  const member = await newOwner('reset-member')
  const inv = await shop.c.post(`/api/shops/${shop.shopId}/invitations`, { email: member.email, role: 'tech' })
  await member.c.post(`/api/invitations/${inv.body.link.split('/invite/')[1]}/accept`)
  return { shop, member }
}

/** A note the shop's owner makes and syncs from another device; its id. */
async function ownerNote(shop: Awaited<ReturnType<typeof newOwner>>, body: string) {
  const id = crypto.randomUUID()
  const d = await device(shop.c, shop.shopId)
  await d.engine.mutate('note.create', { id, jobId: null, body })
  await d.engine.sync()
  return id
}

describe('a device when the server starts its view over (reset)', () => {
  it('on its first sync keeps the changes it made before, beside the shop\'s records', async () => {
    const { shop, member } = await shopWithTech()
    const shopNote = await ownerNote(shop, 'From the bench PC.')

    // Offline from the start: a note made before the device ever synced.
    const d = await device(member.c, shop.shopId)
    const mine = crypto.randomUUID()
    await d.engine.mutate('note.create', { id: mine, jobId: null, body: 'Written in the basement.' })
    const first = await d.engine.pull()
    expect(first.reset).toBe(true)
    expect((await d.db.notes.get(mine))?.body).toBe('Written in the basement.')
    expect((await d.db.notes.get(shopNote))?.body).toBe('From the bench PC.')
    expect(await d.engine.pendingCount()).toBe(1)
    await d.engine.sync()
    expect(await d.engine.pendingCount()).toBe(0)
    expect((await d.db.notes.get(mine))?.version).toBeGreaterThan(0)
  })

  it('after a role change drops what the new role may not see', async () => {
    const { shop, member } = await shopWithTech()
    const shopNote = await ownerNote(shop, 'Staff only.')

    const d = await device(member.c, shop.shopId)
    await d.engine.pull()
    expect((await d.db.notes.get(shopNote))?.body).toBe('Staff only.')
    expect(await d.db.server.where('shopId').equals(shop.shopId).count()).toBeGreaterThan(0)

    expect((await shop.c.patch(`/api/shops/${shop.shopId}/members/${member.userId}`, { role: 'player' })).status).toBe(200)
    const again = await d.engine.pull()
    expect(again.reset).toBe(true)
    expect(await d.db.notes.get(shopNote)).toBeUndefined()
    expect(await d.db.server.get(['notes', shopNote])).toBeUndefined()
  })
})
