import { describe, expect, it } from 'vitest'
import { client, login, newOwner } from './helpers/client'
import { sql } from './helpers/db'

/** An invitation to a fresh shop for a new address: the owner's client, the address and the raw token. */
async function invite(role = 'tech') {
  const owner = await newOwner('invites')
  const email = `invited-${Date.now()}-${Math.random().toString(36).slice(2, 8)}@test.example`
  const inv = await owner.c.post(`/api/shops/${owner.shopId}/invitations`, { email, role })
  expect(inv.status).toBe(201)
  return { owner, email, token: inv.body.link.split('/invite/')[1] as string }
}

const usersWith = (email: string) => sql('select id from users where email = ?', [email])

describe('invitation links', () => {
  it('are single-use: after one registration the link neither opens, registers nor accepts again', async () => {
    const { owner, email, token } = await invite()
    const first = await client().post('/api/auth/register', { email, name: 'First', password: 'long-enough-pw', invitationToken: token })
    expect(first.status).toBe(201)
    expect(first.body.activeShop.id).toBe(owner.shopId)
    expect((await client().get(`/api/invitations/${token}`)).status).toBe(404)
    // The same person again, signed in: nothing more to accept.
    const again = await login(email, 'long-enough-pw')
    expect((await again.post(`/api/invitations/${token}/accept`)).status).toBe(404)
    // A second account trying the used link is refused and not created.
    const other = `reuse-${Date.now()}@test.example`
    expect((await client().post('/api/auth/register', { email: other, name: 'Reuse', password: 'long-enough-pw', invitationToken: token })).status).toBe(404)
    expect(await usersWith(other)).toHaveLength(0)
    const accepted = await sql<{ accepted_at: Date | null }>('select accepted_at from invitations where shop_id = ?', [owner.shopId])
    expect(accepted).toHaveLength(1)
    expect(accepted[0]!.accepted_at).not.toBeNull()
  })

  it('expire: an expired link answers 404 everywhere and registering with it creates no account', async () => {
    const { owner, email, token } = await invite('desk')
    expect((await client().get(`/api/invitations/${token}`)).status).toBe(200)
    await sql('update invitations set expires_at = ? where shop_id = ?', [new Date(Date.now() - 1000), owner.shopId])
    expect((await client().get(`/api/invitations/${token}`)).status).toBe(404)
    const reg = await client().post('/api/auth/register', { email, name: 'Late', password: 'long-enough-pw', invitationToken: token })
    expect(reg.status).toBe(404)
    expect(reg.body.message).toMatch(/no longer valid/)
    expect(await usersWith(email)).toHaveLength(0)
    // An account made without the link cannot accept it either.
    const late = client()
    expect((await late.post('/api/auth/register', { email, name: 'Late', password: 'long-enough-pw' })).status).toBe(201)
    expect((await late.post(`/api/invitations/${token}/accept`)).status).toBe(404)
    const members = await owner.c.get(`/api/shops/${owner.shopId}/members`)
    expect(members.body.members.map((m: { email: string }) => m.email)).not.toContain(email)
  })

  it('are issued for 7 days and stored only as a hash', async () => {
    const { owner, token } = await invite()
    const [row] = await sql<{ token_hash: string, expires_at: Date, created_at: Date }>('select token_hash, expires_at, created_at from invitations where shop_id = ?', [owner.shopId])
    expect(row!.token_hash).toMatch(/^[0-9a-f]{64}$/)
    expect(row!.token_hash).not.toContain(token)
    // common practice, no source: a week is a usual lifetime for an e-mailed invitation.
    const days = (new Date(row!.expires_at).getTime() - new Date(row!.created_at).getTime()) / 86_400_000
    expect(days).toBeGreaterThan(6.99)
    expect(days).toBeLessThan(7.01)
  })
})
