import { execFileSync } from 'node:child_process'
import { describe, expect, it } from 'vitest'
import { DEMO } from './helpers/client'
import { sql } from './helpers/db'
import { evaluateRun, findProcedure, gateComplete } from '../../shared/utils/procedures/index'

const SEEDED = `select 'jobs' t, id, version from jobs where id like '6f1c2a10-0000-4000-8003-%'
  union all select 'customers', id, version from customers where id like '6f1c2a10-0000-4000-8001-%'
  union all select 'events', id, version from job_events where id like '6f1c2a10-0000-4000-8007-%'
  union all select 'invoices', id, version from invoices where id like '6f1c2a10-0000-4000-8006-%'
  union all select 'runs', id, version from procedure_runs where id like '6f1c2a10-0000-4000-8008-%'
  union all select 'gates', id, version from procedure_gates where id like '6f1c2a10-0000-4000-8009-%'
  order by t, id`

describe('demo seed', () => {
  it('runs again without adding or re-stamping rows', async () => {
    const before = await sql(SEEDED)
    expect(before.filter(r => r.t === 'jobs')).toHaveLength(8)
    expect(before.filter(r => r.t === 'events')).toHaveLength(25)
    expect(before.filter(r => r.t === 'runs')).toHaveLength(2)
    expect(before.filter(r => r.t === 'gates')).toHaveLength(2)
    execFileSync('npx', ['tsx', 'server/db/seed.ts'], { env: { ...process.env, NUXT_DATABASE_URL: process.env.TW_TEST_DB_URL }, stdio: 'ignore' })
    expect(await sql(SEEDED)).toEqual(before)
    // Every seeded row carries a version the shop's counter has reached, so pull delivers it.
    const [shop] = await sql('select version from shop_versions where shop_id = ?', [DEMO.shopId])
    expect(Math.max(...before.map(r => Number(r.version)))).toBeLessThanOrEqual(Number(shop.version))
    const [linked] = await sql('select count(*) n from customers where player_user_id is not null and id like \'6f1c2a10-0000-4000-8001-%\'')
    expect(Number(linked.n)).toBe(2)
  }, 60_000)

  it('seeds finished runs that the run rules would let finish, each with its full safety check', async () => {
    const runs = await sql('select r.*, g.items, g.run_id from procedure_runs r join procedure_gates g on g.id = r.gate_id where r.id like \'6f1c2a10-0000-4000-8008-%\'')
    expect(runs).toHaveLength(2)
    for (const r of runs) {
      const procedure = findProcedure(r.procedure_id)!
      const json = (v: unknown) => (typeof v === 'string' ? JSON.parse(v) : v)
      expect(r.run_id).toBe(r.id)
      expect(gateComplete(procedure, json(r.items))).toBe(true)
      expect(r.status).toBe('done')
      expect(evaluateRun(procedure, r.variant, { tubes: r.tube_count, caps: r.cap_count }, json(r.readings)).canFinish).toBe(true)
    }
  })
})
