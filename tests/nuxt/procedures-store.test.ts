import { describe, expect, it } from 'vitest'
import { findProcedure } from '#shared/utils/procedures/index'
import { fakeSyncServer, SHOP_ID, signInLocally, until } from './helpers/device'
import { useProceduresStore } from '~/stores/procedures'
import { useSyncStore } from '~/stores/sync'

const caps = findProcedure('drain-and-verify-caps')!
const allItems = caps.gate.map(g => g.id)
const start = { procedureId: caps.id, variant: '', jobId: null, tubeCount: 2, capCount: 3 }

describe('procedures store (offline, on the device)', () => {
  it('queues the safety check before its run, and the run shows with its check', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    const user = signInLocally('tech')
    const sync = useSyncStore()
    const store = useProceduresStore()
    await until(() => !!sync.engine, 'the engine to start')

    const runId = await store.start({ ...start, items: allItems })
    const queued = await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')
    expect(queued.map(m => m.name)).toEqual(['procedureGate.create', 'procedureRun.create'])
    const gateArgs = queued[0]!.args as { id: string, runId: string, items: string[], acknowledgedAt: string }
    expect(gateArgs.runId).toBe(runId)
    expect(gateArgs.items).toEqual(allItems)
    expect(Date.parse(gateArgs.acknowledgedAt)).not.toBeNaN()
    expect(queued[1]!.args).toMatchObject({ id: runId, gateId: gateArgs.id, procedureId: caps.id, capCount: 3 })

    await until(() => !!store.find(runId), 'the run to show')
    const run = store.find(runId)!
    expect(run.status).toBe('running')
    expect(run.createdBy).toBe(user.id)
    expect(store.gateOf(run)?.id).toBe(gateArgs.id)
    expect(store.unfinished.map(r => r.id)).toEqual([runId])
    expect(await store.hasGatedRun(runId)).toBe(true)
    expect(await store.hasGatedRun(crypto.randomUUID())).toBe(false)
  })

  it('refuses to start without every item ticked, for a player inside the chassis, or with a made-up method', async () => {
    fakeSyncServer().mode = 'down'
    signInLocally('tech')
    const sync = useSyncStore()
    const store = useProceduresStore()
    await until(() => !!sync.engine, 'the engine to start')
    await expect(store.start({ ...start, items: allItems.slice(1) })).rejects.toThrow('Tick every item')
    await expect(store.start({ ...start, procedureId: 'set-fixed-bias', variant: 'shunt', items: findProcedure('set-fixed-bias')!.gate.map(g => g.id) }))
      .rejects.toThrow('Choose how you will measure')
    expect(await sync.db!.outbox.where('shopId').equals(SHOP_ID).count()).toBe(0)

    signInLocally('player', { id: crypto.randomUUID(), name: 'Dana Whitlow', email: 'dana@players.example' })
    const player = useSyncStore()
    await until(() => !!player.engine, 'the player engine to start')
    await expect(store.start({ ...start, items: allItems })).rejects.toThrow('Your role may not run this procedure')
    const backstage = findProcedure('backstage-check')!
    await expect(store.start({ ...start, procedureId: backstage.id, items: backstage.gate.map(g => g.id) })).resolves.toMatch(/^[0-9a-f-]{36}$/)
  })

  it('keeps an out-of-range reading with its warning, clears it to measure again, and finishes', async () => {
    fakeSyncServer().mode = 'down'
    signInLocally('tech')
    const sync = useSyncStore()
    const store = useProceduresStore()
    await until(() => !!sync.engine, 'the engine to start')
    const runId = await store.start({ ...start, items: allItems })
    await until(() => !!store.find(runId), 'the run to show')

    const at = new Date().toISOString()
    await store.stopAt(store.find(runId)!, 'verify:1', { value: 62, at }, 'Still above 50 V')
    await until(() => store.find(runId)!.warnings.length === 1, 'the warning')
    expect(store.find(runId)!.readings['verify:1']).toEqual({ value: 62, at })
    expect(store.find(runId)!.stepIndex).toBe(0)
    await store.clearReading(store.find(runId)!, 'verify:1')
    await until(() => !store.find(runId)!.readings['verify:1'], 'the reading to clear')
    expect(store.find(runId)!.warnings).toEqual([{ step: 'verify:1', text: 'Still above 50 V', value: 62, at }])

    await store.record(store.find(runId)!, 'verify:1', { value: 4, at }, 5)
    await until(() => store.find(runId)!.stepIndex === 5, 'the run to move on')
    await store.end(store.find(runId)!, 'Customer collected it')
    await until(() => store.find(runId)!.status === 'stopped', 'the run to end')
    expect(store.find(runId)!.endReason).toBe('Customer collected it')
    expect(store.unfinished).toEqual([])
  })
})
