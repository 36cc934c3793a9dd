// Every screen of the app with a real address from the demo shop, for the accessibility and
// keyboard tests. A page file under app/pages with no row here fails the test that lists them.
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { randomUUID } from 'node:crypto'
import { SYNC_SCHEMA_VERSION } from '../../../shared/utils/sync/protocol'
import { client, DEMO, DEMO_PASSWORD, type Client } from '../../api/helpers/client'
import { BASE } from './browser'

/** `app/pages/jobs/[id]/index.vue` -> `/jobs/[id]`. */
export function pageRoutes(dir = 'app/pages'): string[] {
  const out: string[] = []
  const walk = (d: string) => {
    for (const name of readdirSync(d)) {
      const p = join(d, name)
      if (statSync(p).isDirectory()) walk(p)
      else if (name.endsWith('.vue')) out.push(`/${relative(dir, p).replace(/\.vue$/, '').replace(/(^|\/)index$/, '')}`.replace(/\/$/, '') || '/')
    }
  }
  walk(dir)
  return out.sort()
}

const idOf = (group: string, n: number) => `6f1c2a10-0000-4000-8${group}-${String(n).padStart(12, '0')}`
const DEMO_JOB = idOf('003', 1)
const DEMO_RUN = idOf('008', 2)
const DEMO_RIG = idOf('010', 1)
const DEMO_SET = idOf('022', 1)

export interface Made { inviteToken: string, payToken: string, conflictNoteBody: string }

export interface PageRow {
  /** Who looks (null: signed out). */
  as: string | null
  path: (made: Made) => string
  /** Where the page sends people, when it is only a way to another screen. */
  lands?: string
}

export const PAGES: Record<string, PageRow> = {
  '/': { as: DEMO.tech, path: () => '/' },
  '/account': { as: DEMO.owner, path: () => '/account' },
  // Sends people to the Bench list at /.
  '/bench': { as: DEMO.tech, path: () => '/bench', lands: '/' },
  '/bench/[tool]': { as: DEMO.tech, path: () => '/bench/idle-dissipation' },
  '/invite/[token]': { as: null, path: m => `/invite/${m.inviteToken}` },
  '/jobs': { as: DEMO.desk, path: () => '/jobs' },
  '/jobs/new': { as: DEMO.desk, path: () => '/jobs/new' },
  '/jobs/[id]': { as: DEMO.desk, path: () => `/jobs/${DEMO_JOB}` },
  '/jobs/[id]/record': { as: DEMO.desk, path: () => `/jobs/${DEMO_JOB}/record` },
  '/more': { as: DEMO.owner, path: () => '/more' },
  '/notebook': { as: DEMO.tech, path: () => '/notebook' },
  '/pay/[token]': { as: null, path: m => `/pay/${m.payToken}` },
  '/procedures': { as: DEMO.tech, path: () => '/procedures' },
  '/procedures/[id]': { as: DEMO.tech, path: () => '/procedures/set-fixed-bias' },
  '/procedures/[id]/run/[runId]': { as: DEMO.tech, path: () => `/procedures/set-fixed-bias/run/${DEMO_RUN}` },
  '/register': { as: null, path: () => '/register' },
  '/rigs': { as: DEMO.dana, path: () => '/rigs' },
  '/rigs/[id]': { as: DEMO.dana, path: () => `/rigs/${DEMO_RIG}` },
  '/rigs/[id]/backstage': { as: DEMO.dana, path: () => `/rigs/${DEMO_RIG}/backstage` },
  '/shop': { as: DEMO.owner, path: () => '/shop' },
  '/shop/outbox': { as: DEMO.owner, path: () => '/shop/outbox' },
  '/shop/settings': { as: DEMO.owner, path: () => '/shop/settings' },
  '/signin': { as: null, path: () => '/signin' },
  '/sync': { as: DEMO.owner, path: () => '/sync' },
  // Filled in by the test from the conflict the owner's device pulled.
  '/sync/conflicts/[id]': { as: DEMO.owner, path: () => '/sync/conflicts/' },
  '/tubes': { as: DEMO.tech, path: () => '/tubes' },
  '/tubes/stock': { as: DEMO.tech, path: () => '/tubes/stock' },
  '/tubes/stock/sets/[id]': { as: DEMO.tech, path: () => `/tubes/stock/sets/${DEMO_SET}` },
}

async function signIn(email: string): Promise<Client> {
  const c = client(BASE)
  const r = await c.post('/api/auth/login', { email, password: DEMO_PASSWORD })
  if (r.status !== 200) throw new Error(`login ${email}: ${r.status}`)
  return c
}

const push = (c: Client, clientId: string, mutations: { id: number, name: string, args: unknown, baseVersion?: number }[]) =>
  c.post('/api/sync/push', { clientId, shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: mutations.map(m => ({ uuid: randomUUID(), ...m })) })

/** Decides the conflict made below (the other browser tests expect the demo shop to be in sync). */
export async function resolveConflict(conflictId: string) {
  const owner = await signIn(DEMO.owner)
  const r = await push(owner, randomUUID(), [{ id: 1, name: 'conflict.resolve', args: { id: conflictId, value: 'Bias steady after an hour' } }])
  if (r.status !== 200) throw new Error(`resolving the conflict: ${r.status} ${JSON.stringify(r.body)}`)
}

/** What the token and conflict pages need: an invitation, a sent invoice's pay link, an open conflict. */
export async function makeDemoRecords(): Promise<Made> {
  const [owner, desk, tech] = await Promise.all([DEMO.owner, DEMO.desk, DEMO.tech].map(signIn))
  const invite = await owner.post(`/api/shops/${DEMO.shopId}/invitations`, { email: `a11y-${randomUUID().slice(0, 8)}@test.example`, role: 'tech' })
  if (invite.status !== 201) throw new Error(`invite: ${invite.status}`)

  const customer = (await desk.get('/api/customers?q=dana@players.example')).body.items[0]
  const amp = (await desk.post('/api/amps', { customerId: customer.id, description: '18 W two-EL84 combo, cathode biased', serial: `A11Y-${randomUUID().slice(0, 6)}` })).body
  const job = (await desk.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Check the bias' })).body
  await push(owner, randomUUID(), [{ id: 1, name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes: 30, rateCents: 9000 } }])
  const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
  await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })
  const link = await desk.post(`/api/invoices/${inv.id}/pay-link`)
  if (link.status !== 201) throw new Error(`pay link: ${link.status}`)

  // Two people edit one note's text from the same version: the second is a conflict.
  const noteId = randomUUID()
  const conflictNoteBody = `Bias drifts ${noteId.slice(0, 6)}`
  await push(tech, randomUUID(), [
    { id: 1, name: 'note.create', args: { id: noteId, jobId: DEMO_JOB, body: 'Bias drifts when warm' } },
    { id: 2, name: 'note.setFields', args: { id: noteId, fields: { body: conflictNoteBody } } },
  ])
  const r = await push(owner, randomUUID(), [{ id: 1, name: 'note.setFields', args: { id: noteId, fields: { body: 'Bias steady after an hour' } }, baseVersion: 1 }])
  if (r.body.results?.[0]?.status !== 'conflict') throw new Error(`expected a conflict: ${JSON.stringify(r.body)}`)
  return { inviteToken: invite.body.link.split('/invite/')[1], payToken: link.body.url.split('/pay/')[1], conflictNoteBody }
}
