import { describe, expect, it } from 'vitest'
import { client, DEMO, login, newOwner } from './helpers/client'
import { waitForMail } from './helpers/mail'

describe('shops and members', () => {
  it('makes the creator the owner and the active shop', async () => {
    const { c, shopId } = await newOwner()
    const me = await c.get('/api/auth/me')
    expect(me.body.activeShop).toMatchObject({ id: shopId, role: 'owner' })
  })

  it('lets staff list members, refuses players (403) and outsiders (404)', async () => {
    const tech = await login(DEMO.tech)
    const list = await tech.get(`/api/shops/${DEMO.shopId}/members`)
    expect(list.status).toBe(200)
    expect(list.body.members.map((m: { email: string }) => m.email)).toContain(DEMO.owner)
    expect((await (await login(DEMO.dana)).get(`/api/shops/${DEMO.shopId}/members`)).status).toBe(403)
    const outsider = await newOwner('outsider')
    expect((await outsider.c.get(`/api/shops/${DEMO.shopId}/members`)).status).toBe(404)
    expect((await tech.get(`/api/shops/${outsider.shopId}/members`)).status).toBe(404)
    expect((await client().get(`/api/shops/${DEMO.shopId}/members`)).status).toBe(401)
  })

  it('does not let a tech manage members (403)', async () => {
    const tech = await login(DEMO.tech)
    const desk = (await (await login(DEMO.desk)).get('/api/auth/me')).body.user.id
    expect((await tech.post(`/api/shops/${DEMO.shopId}/invitations`, { email: 'x@test.example', role: 'tech' })).status).toBe(403)
    expect((await tech.patch(`/api/shops/${DEMO.shopId}/members/${desk}`, { role: 'owner' })).status).toBe(403)
    expect((await tech.del(`/api/shops/${DEMO.shopId}/members/${desk}`)).status).toBe(403)
    expect((await tech.get(`/api/shops/${DEMO.shopId}/invitations`)).status).toBe(403)
  })

  it('invites by e-mail, and the invitee registers through the link and joins with that role', async () => {
    const { c: owner, shopId } = await newOwner('inviter')
    const email = `invitee-${Date.now()}@test.example`
    const inv = await owner.post(`/api/shops/${shopId}/invitations`, { email, role: 'desk' })
    expect(inv.status).toBe(201)
    expect(inv.body.link).toMatch(/\/invite\/[\w-]+$/)
    const mail = await waitForMail(email)
    const token = inv.body.link.split('/invite/')[1]
    expect(mail.raw).toContain(token)

    const info = await client().get(`/api/invitations/${token}`)
    expect(info.status).toBe(200)
    expect(info.body).toMatchObject({ email, role: 'desk' })

    const invitee = client()
    const reg = await invitee.post('/api/auth/register', { email, name: 'Invitee', password: 'long-enough-pw', invitationToken: token })
    expect(reg.status).toBe(201)
    expect(reg.body.activeShop).toMatchObject({ id: shopId, role: 'desk' })
    // Used once only.
    expect((await client().get(`/api/invitations/${token}`)).status).toBe(404)
    const members = await owner.get(`/api/shops/${shopId}/members`)
    expect(members.body.members.find((m: { email: string }) => m.email === email).role).toBe('desk')
  })

  it('accepts an invitation for an existing account, only for the invited address', async () => {
    const { c: owner, shopId } = await newOwner('inviter2')
    const other = await newOwner('existing')
    const inv = await owner.post(`/api/shops/${shopId}/invitations`, { email: other.email, role: 'tech' })
    const token = inv.body.link.split('/invite/')[1]
    const stranger = await newOwner('stranger')
    expect((await stranger.c.post(`/api/invitations/${token}/accept`)).status).toBe(403)
    const ok = await other.c.post(`/api/invitations/${token}/accept`)
    expect(ok.status).toBe(200)
    expect(ok.body.memberships.map((m: { shopId: string }) => m.shopId)).toContain(shopId)
    expect(ok.body.activeShop.id).toBe(shopId)
    // Switching back to their own shop.
    const sw = await other.c.post('/api/auth/active-shop', { shopId: other.shopId })
    expect(sw.body.activeShop).toMatchObject({ id: other.shopId, role: 'owner' })
    expect((await other.c.post('/api/auth/active-shop', { shopId: stranger.shopId })).status).toBe(404)
  })

  it('changes roles, removes members, and never removes the last owner', async () => {
    const { c: owner, shopId, userId: ownerId } = await newOwner('roles')
    const second = await newOwner('second')
    const inv = await owner.post(`/api/shops/${shopId}/invitations`, { email: second.email, role: 'tech' })
    await second.c.post(`/api/invitations/${inv.body.link.split('/invite/')[1]}/accept`)

    expect((await owner.del(`/api/shops/${shopId}/members/${ownerId}`)).status).toBe(409)
    expect((await owner.patch(`/api/shops/${shopId}/members/${ownerId}`, { role: 'tech' })).status).toBe(409)
    expect((await owner.patch(`/api/shops/${shopId}/members/${second.userId}`, { role: 'wizard' })).status).toBe(400)
    expect((await owner.patch(`/api/shops/${shopId}/members/${second.userId}`, { role: 'owner' })).status).toBe(200)
    // Now two owners: the first may step down.
    expect((await owner.patch(`/api/shops/${shopId}/members/${ownerId}`, { role: 'desk' })).status).toBe(200)
    expect((await second.c.del(`/api/shops/${shopId}/members/${ownerId}`)).status).toBe(200)
    const members = await second.c.get(`/api/shops/${shopId}/members`)
    expect(members.body.members.map((m: { userId: string }) => m.userId)).toEqual([second.userId])
    expect((await owner.get(`/api/shops/${shopId}/members`)).status).toBe(404)
  })

  it('withdraws an invitation so its link stops working', async () => {
    const { c: owner, shopId } = await newOwner('withdraw')
    const inv = await owner.post(`/api/shops/${shopId}/invitations`, { email: 'gone@test.example', role: 'player' })
    const token = inv.body.link.split('/invite/')[1]
    const list = await owner.get(`/api/shops/${shopId}/invitations`)
    expect(list.body.invitations.map((i: { id: string }) => i.id)).toContain(inv.body.id)
    expect((await owner.del(`/api/shops/${shopId}/invitations/${inv.body.id}`)).status).toBe(200)
    expect((await client().get(`/api/invitations/${token}`)).status).toBe(404)
  })

  it('answers 400 with a message for bad ids and bodies', async () => {
    const owner = await login(DEMO.owner)
    const r1 = await owner.get('/api/shops/not-a-uuid/members')
    expect(r1.status).toBe(400)
    expect(r1.body.message).toMatch(/shopId/)
    const r2 = await owner.post(`/api/shops/${DEMO.shopId}/invitations`, { email: 'x', role: 'tech' })
    expect(r2.status).toBe(400)
    const r3 = await owner.post('/api/shops', { name: '' })
    expect(r3.status).toBe(400)
  })
})
