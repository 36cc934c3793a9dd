import { describe, expect, it } from 'vitest'
import { computeTool, ENGINE_VERSION } from '#shared/utils/bench'
import { fakeSyncServer, SHOP_ID, signInLocally, until } from './helpers/device'
import { useMeasurementsStore } from '~/stores/measurements'
import { useSyncStore } from '~/stores/sync'
import { summarize } from '~/utils/notebook/measurement-summary'

// One tube of a fixed-bias pair, plate current read directly.
const inputs = { method: 'direct', mode: 'fixed', plateVolts: 400, amps: 0.03, maxPlateWatts: 30 }

describe('measurements store (offline, on the device)', () => {
  it('saves a bench result to the outbox and the list, newest first, and deletes it', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    const user = signInLocally()
    const sync = useSyncStore()
    const store = useMeasurementsStore()
    await until(() => !!sync.engine, 'the engine to start')

    const outputs = computeTool('idle-dissipation', inputs)
    // Source: P = V × I (definition of electric power): 400 V × 0.030 A = 12 W; 12 W of a 30 W rating is 40 %.
    expect(outputs.watts).toBeCloseTo(12, 9)
    expect(outputs.percent).toBeCloseTo(40, 9)
    const first = await store.save({ tool: 'idle-dissipation', inputs, outputs, label: 'V1 left', attach: { kind: 'notebook' } })
    await new Promise(r => setTimeout(r, 5))
    const jobId = crypto.randomUUID()
    const second = await store.save({ tool: 'idle-dissipation', inputs: { ...inputs, amps: 0.04 }, outputs: computeTool('idle-dissipation', { ...inputs, amps: 0.04 }), attach: { kind: 'job', id: jobId } })
    expect(first).toMatch(/^[0-9a-f-]{36}$/)
    expect(second).not.toBe(first)

    const queued = await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')
    expect(queued.map(m => m.name)).toEqual(['measurement.create', 'measurement.create'])
    expect(queued[0]!.args).toEqual({ id: first, tool: 'idle-dissipation', inputs, outputs: JSON.parse(JSON.stringify(outputs)), engineVersion: ENGINE_VERSION, label: 'V1 left', jobId: null, rigId: null })
    expect(queued[1]!.args).toMatchObject({ id: second, jobId, rigId: null })
    expect(queued[1]!.args).not.toHaveProperty('label')

    await until(() => store.all.length === 2, 'the list to show both')
    expect(store.all.map(m => m.id)).toEqual([second, first])
    expect(store.inNotebook.map(m => m.id)).toEqual([first])
    expect(store.forJob(jobId).map(m => m.id)).toEqual([second])
    expect(store.all.every(m => m.createdBy === user.id && m.pending === 1 && m.version === 0)).toBe(true)

    // Source: as above, 12 W is 40 % of 30 W: below the fixed-bias 'in range' start of 50 % (common practice, no source) → cold.
    expect(summarize('idle-dissipation', store.inNotebook[0]!.outputs)).toEqual({ headline: '12 W · 40 % of rating', band: 'cold' })

    await store.remove(first)
    await until(() => store.all.length === 1, 'the deleted result to leave the list')
    const after = await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')
    expect(after.at(-1)).toMatchObject({ name: 'measurement.delete', args: { id: first }, baseVersion: 0 })
    expect(store.inNotebook).toHaveLength(0)
    // Nothing reached the server while it was down, and nothing was lost.
    expect(server.pushes).toHaveLength(0)
    await until(() => sync.pending === 3, 'three changes waiting')
  })
})
