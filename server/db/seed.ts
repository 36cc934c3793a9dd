// Seeds the demo shop; safe to run again (fixed ids, upserts, passwords only set once).
import { drizzle } from 'drizzle-orm/mysql2'
import { createPool } from 'mysql2/promise'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { eq, inArray, sql } from 'drizzle-orm'
import type { MySqlTransaction } from 'drizzle-orm/mysql-core'
import * as schema from './schema/index'
import { invoiceTotals, labourTotalCents, partTotalCents } from '../../shared/utils/jobs/money'
import { expandSteps, findProcedure } from '../../shared/utils/procedures/index'
import { setSpread } from '../../shared/utils/bench/set-spread'
import { bumpShopVersion, lockShopVersion } from '../utils/transactions'
import {
  DEMO_AMPS, DEMO_CUSTOMERS, DEMO_INVOICE, DEMO_JOBS, DEMO_LABOUR, DEMO_LOTS, DEMO_PARTS, DEMO_PERSONAL_SPACES, DEMO_RIGS, DEMO_RUNS, DEMO_SEED_CLIENT, DEMO_SETS,
  DEMO_RIG_SUGGESTION, DEMO_SETTINGS, DEMO_SHOP, DEMO_STOCK_TUBES, DEMO_USERS, demoEventId, demoRigGigId, demoRigSetId, demoRigShareId,
} from './demo'

const url = process.env.NUXT_DATABASE_URL
if (!url) {
  console.error('NUXT_DATABASE_URL is not set.')
  process.exit(1)
}
const password = process.env.TW_DEMO_PASSWORD || 'tubewright-demo'
// Same scrypt defaults as nuxt-auth-utils' hashPassword, so the server verifies these hashes.
const hash = new Hash(new Scrypt({}))

// eslint-disable-next-line @typescript-eslint/no-explicit-any -- the seed's own drizzle instance
type Tx = MySqlTransaction<any, any, typeof schema, any>
const SHOP = DEMO_SHOP.id
const OWNER = DEMO_USERS[0]!.id
const DESK = DEMO_USERS[2]!.id
const TECH = DEMO_USERS[1]!.id
const HOUR = 3_600_000

/**
 * The demo jobs, parts, labour, timeline and invoice. Rows already there are left alone; each
 * new row takes the next shop version (under the version row's lock) so it syncs down like any
 * other change.
 */
async function seedJobs(tx: Tx) {
  let version = await lockShopVersion(tx, SHOP)
  const start = version
  const now = Date.now()
  const day = (d: number) => new Date(now - d * 24 * HOUR)
  const stamps = (fields: object, v: number, by: string, at: Date) =>
    Object.fromEntries(Object.keys(fields).map(k => [k, { v, c: DEMO_SEED_CLIENT, u: by, at: at.toISOString() }]))

  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- one helper for the five synced tables
  async function missing<T extends { id: string }>(table: any, rows: T[]): Promise<T[]> {
    const have = await tx.select({ id: table.id }).from(table).where(inArray(table.id, rows.map(r => r.id))) as { id: string }[]
    return rows.filter(r => !have.some(h => h.id === r.id))
  }
  const synced = (fields: object, by: string, at: Date) => {
    version++
    return { shopId: SHOP, version, fieldStamps: stamps(fields, version, by, at), createdBy: by, updatedBy: by, createdAt: at, updatedAt: at }
  }

  await tx.insert(schema.shopSettings).ignore().values({ shopId: SHOP, ...DEMO_SETTINGS })
  const jobAt = new Map(DEMO_JOBS.map(j => [j.id, day(j.daysAgo)]))
  for (const { id, ...f } of await missing(schema.customers, DEMO_CUSTOMERS)) {
    await tx.insert(schema.customers).values({ id, ...f, ...synced(f, DESK, day(8)) })
  }
  for (const { id, ...f } of await missing(schema.amps, DEMO_AMPS)) {
    await tx.insert(schema.amps).values({ id, ...f, ...synced(f, DESK, day(8)) })
  }
  for (const j of await missing(schema.jobs, DEMO_JOBS)) {
    const at = jobAt.get(j.id)!
    const status = j.path.at(-1)!
    const promisedFor = j.promisedFor === null ? '' : new Date(now + j.promisedFor * 24 * HOUR).toISOString().slice(0, 10)
    const f = { customerId: j.customerId, ampId: j.ampId, complaint: j.complaint, accessories: j.accessories, photos: [] as string[], promisedFor, assignedTo: j.assignedTo, priority: j.priority, status }
    await tx.insert(schema.jobs).values({ id: j.id, ...f, ...synced(f, DESK, at) })
    // The timeline: one event per move, a few hours apart.
    for (const [step, to] of j.path.entries()) {
      version++
      const by = step === 0 ? DESK : j.assignedTo ?? OWNER
      await tx.insert(schema.jobEvents).ignore().values({
        id: demoEventId(DEMO_JOBS.indexOf(j), step), shopId: SHOP, jobId: j.id, fromStatus: step === 0 ? null : j.path[step - 1]!,
        toStatus: to, byUser: by, at: new Date(at.getTime() + step * 5 * HOUR), version,
      })
    }
  }
  for (const { id, ...f } of await missing(schema.jobParts, DEMO_PARTS)) {
    await tx.insert(schema.jobParts).values({ id, ...f, ...synced(f, TECH, new Date(jobAt.get(f.jobId)!.getTime() + 6 * HOUR)) })
  }
  for (const { id, ...f } of await missing(schema.jobLabour, DEMO_LABOUR)) {
    await tx.insert(schema.jobLabour).values({ id, ...f, ...synced(f, TECH, new Date(jobAt.get(f.jobId)!.getTime() + 6 * HOUR)) })
  }
  for (const r of await missing(schema.procedureRuns, DEMO_RUNS)) {
    const procedure = findProcedure(r.procedureId)!
    const at = new Date(jobAt.get(r.jobId)!.getTime() + r.hoursIn * HOUR)
    const minute = (n: number) => new Date(at.getTime() + n * 60_000).toISOString()
    const gate = { runId: r.id, procedureId: r.procedureId, jobId: r.jobId, items: procedure.gate.map(g => g.id), acknowledgedAt: at.toISOString() }
    await tx.insert(schema.procedureGates).ignore().values({ id: r.gateId, ...gate, ...synced(gate, TECH, at) })
    const steps = expandSteps(procedure, r.variant, { tubes: r.tubeCount, caps: r.capCount })
    const readings = Object.fromEntries(steps.map((s, i) => [s.key, { ...(s.key in r.values ? { value: r.values[s.key] } : {}), at: minute(3 * (i + 1)) }]))
    const run = {
      procedureId: r.procedureId, gateId: r.gateId, variant: r.variant, jobId: r.jobId, tubeCount: r.tubeCount, capCount: r.capCount,
      status: 'done' as const, stepIndex: steps.length, readings, warnings: [], endedAt: minute(3 * steps.length + 1), endReason: '',
    }
    await tx.insert(schema.procedureRuns).values({ id: r.id, ...run, ...synced(run, TECH, at) })
  }
  // Tube stock: the lot, its tubes read the day it came in, then the quad matched from them.
  for (const { id, daysAgo, ...f } of await missing(schema.tubeLots, DEMO_LOTS)) {
    const received = { ...f, receivedOn: day(daysAgo).toISOString().slice(0, 10) }
    await tx.insert(schema.tubeLots).values({ id, ...received, ...synced(received, TECH, day(daysAgo)) })
  }
  for (const { id, ...f } of await missing(schema.stockTubes, DEMO_STOCK_TUBES)) {
    const at = day(DEMO_LOTS.find(l => l.id === f.lotId)!.daysAgo)
    const tube = { ...f, testedOn: at.toISOString().slice(0, 10) }
    await tx.insert(schema.stockTubes).values({ id, ...tube, ...synced(tube, TECH, at) })
  }
  for (const { id, ...f } of await missing(schema.matchedSets, DEMO_SETS)) {
    const amps = f.tubeIds.map(t => DEMO_STOCK_TUBES.find(s => s.id === t)!.amps)
    const set = { ...f, spreadFraction: setSpread(amps), sorterResultId: null, status: 'in-stock' as const, fittedJobId: null, fittedAt: '', priceCents: null }
    await tx.insert(schema.matchedSets).values({ id, ...set, ...synced(set, TECH, day(DEMO_LOTS[0]!.daysAgo - 0.2)) })
  }
  const [invoice] = await tx.select({ id: schema.invoices.id }).from(schema.invoices).where(eq(schema.invoices.id, DEMO_INVOICE.id))
  if (!invoice) {
    const parts = DEMO_PARTS.filter(p => p.jobId === DEMO_INVOICE.jobId)
    const labour = DEMO_LABOUR.filter(l => l.jobId === DEMO_INVOICE.jobId)
    const totals = invoiceTotals(parts, labour, DEMO_SETTINGS.taxRateBasisPoints)
    version++
    await tx.insert(schema.invoices).values({
      id: DEMO_INVOICE.id, shopId: SHOP, jobId: DEMO_INVOICE.jobId, number: DEMO_INVOICE.number, kind: 'invoice', state: 'sent',
      lines: [
        ...parts.map(p => ({ kind: 'part' as const, description: p.description, quantity: p.quantity, unitCents: p.unitPriceCents, totalCents: partTotalCents(p) })),
        ...labour.map(l => ({ kind: 'labour' as const, description: l.description, quantity: l.minutes / 60, unitCents: l.rateCents, totalCents: labourTotalCents(l) })),
      ],
      ...totals, taxRateBasisPoints: DEMO_SETTINGS.taxRateBasisPoints, currency: DEMO_SETTINGS.currency, issuedAt: day(0.5), version,
    })
    await tx.insert(schema.invoiceCounters).values({ shopId: SHOP, kind: 'invoice', last: DEMO_INVOICE.number })
      .onDuplicateKeyUpdate({ set: { last: sql`GREATEST(${schema.invoiceCounters.last}, ${DEMO_INVOICE.number})` } })
  }
  if (version !== start) await bumpShopVersion(tx, SHOP, version)
}

/**
 * Dana's and Sam's rigs in their personal spaces: sets with readings over months, gigs, and the
 * share of Dana's combo with the demo shop. Rows already there are left alone.
 */
async function seedRigs(tx: Tx) {
  const now = Date.now()
  const dayOf = (daysAgo: number) => new Date(now - daysAgo * 24 * HOUR).toISOString().slice(0, 10)
  const at = (daysAgo: number) => new Date(now - daysAgo * 24 * HOUR)
  for (const space of DEMO_PERSONAL_SPACES) {
    await tx.insert(schema.shops).ignore().values(space)
    await tx.insert(schema.memberships).ignore().values({ shopId: space.id, userId: space.personalOf, role: 'player' })
  }
  for (const space of DEMO_PERSONAL_SPACES) {
    const rigs = DEMO_RIGS.filter(r => r.player === space.personalOf)
    const [have] = await tx.select({ id: schema.rigs.id }).from(schema.rigs).where(inArray(schema.rigs.id, rigs.map(r => r.id)))
    if (have) continue
    let version = await lockShopVersion(tx, space.id)
    const by = space.personalOf
    const synced = (fields: object, when: Date) => {
      version++
      const stamp = { v: version, c: DEMO_SEED_CLIENT, u: by, at: when.toISOString() }
      return { shopId: space.id, version, fieldStamps: Object.fromEntries(Object.keys(fields).map(k => [k, stamp])), createdBy: by, updatedBy: by, createdAt: when, updatedAt: when }
    }
    for (const r of rigs) {
      const oldest = Math.max(...r.sets.map(x => x.fittedDaysAgo)) + 10
      const rig = { description: r.description, serial: r.serial, tubes: r.tubes, biasMode: r.biasMode, speakerLoadOhms: r.speakerLoadOhms, outputTapOhms: r.outputTapOhms, retubeHours: r.retubeHours, retubeMonths: r.retubeMonths, notes: r.notes }
      await tx.insert(schema.rigs).values({ id: r.id, ...rig, ...synced(rig, at(oldest)) })
      for (const s of r.sets) {
        // A slow drift down as the set ages (invented).
        const readings = s.readDaysAgo.flatMap((d, k) => Object.entries(s.base).map(([position, mA]) => ({ on: dayOf(d), position, mA: Math.round((mA - k * 0.8) * 10) / 10, plateVolts: s.plateVolts })))
        const set = {
          rigId: r.id, fittedOn: dayOf(s.fittedDaysAgo), fittedBy: s.fittedBy, tubes: Object.keys(s.base).map(position => ({ position, type: s.type })),
          readings, spare: !!s.spare, retiredOn: s.retiredDaysAgo === undefined ? '' : dayOf(s.retiredDaysAgo),
        }
        await tx.insert(schema.rigTubeSets).values({ id: demoRigSetId(s.n), ...set, ...synced(set, at(s.fittedDaysAgo)) })
      }
      let n = 0
      for (let d = r.gigs.fromDaysAgo; d > 0; d -= r.gigs.every) {
        const gig = { rigId: r.id, playedOn: dayOf(d), hours: r.gigs.hours, note: '' }
        await tx.insert(schema.rigGigs).values({ id: demoRigGigId(DEMO_RIGS.indexOf(r), n++), ...gig, ...synced(gig, at(d)) })
      }
      if (r.shared) {
        const share = { rigId: r.id, sharedShopId: SHOP }
        await tx.insert(schema.rigShares).values({ id: demoRigShareId(DEMO_RIGS.indexOf(r)), ...share, ...synced(share, at(30)) })
      }
    }
    await bumpShopVersion(tx, space.id, version)
  }
  const { id, by, ...fields } = DEMO_RIG_SUGGESTION
  const [had] = await tx.select({ id: schema.rigSuggestions.id }).from(schema.rigSuggestions).where(eq(schema.rigSuggestions.id, id))
  if (had) return
  // In the shop: the bench's suggestion for the rig Dana shares with it.
  const version = (await lockShopVersion(tx, SHOP)) + 1
  const when = at(20)
  const stamp = { v: version, c: DEMO_SEED_CLIENT, u: by, at: when.toISOString() }
  await tx.insert(schema.rigSuggestions).values({
    id, ...fields, shopId: SHOP, version, fieldStamps: Object.fromEntries(Object.keys(fields).map(k => [k, stamp])),
    createdBy: by, updatedBy: by, createdAt: when, updatedAt: when,
  })
  await bumpShopVersion(tx, SHOP, version)
}

const pool = createPool({ uri: url, timezone: 'Z', connectionLimit: 2 })
const db = drizzle(pool, { schema, mode: 'planetscale' })
try {
  const passwordHash = await hash.make(password)
  await db.transaction(async (tx) => {
    await tx.insert(schema.shops).values(DEMO_SHOP).onDuplicateKeyUpdate({ set: { name: DEMO_SHOP.name } })
    for (const u of DEMO_USERS) {
      await tx.insert(schema.users).values({ id: u.id, email: u.email, name: u.name, passwordHash })
        .onDuplicateKeyUpdate({ set: { name: u.name } })
      await tx.insert(schema.memberships).values({ shopId: DEMO_SHOP.id, userId: u.id, role: u.role })
        .onDuplicateKeyUpdate({ set: { role: sql`role` } })
    }
    await seedJobs(tx as unknown as Tx)
    await seedRigs(tx as unknown as Tx)
  })
  console.log(`[tubewright] Demo shop "${DEMO_SHOP.name}" seeded.`)
}
finally {
  await pool.end()
}
