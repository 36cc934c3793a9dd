// One step of a run, offline: a confirmation, and a reading out of its range that stops the run there.
import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { ProceduresStep } from '#components'
import { expandSteps, findProcedure } from '#shared/utils/procedures/index'
import { fakeSyncServer, signInLocally, until } from './helpers/device'
import { useProceduresStore } from '~/stores/procedures'
import { useSyncStore } from '~/stores/sync'

const caps = findProcedure('drain-and-verify-caps')!
const steps = expandSteps(caps, '', { tubes: 2, caps: 3 })

async function runOnDevice() {
  fakeSyncServer().mode = 'down'
  signInLocally('tech')
  const sync = useSyncStore()
  const store = useProceduresStore()
  await until(() => !!sync.engine, 'the engine to start')
  const runId = await store.start({ procedureId: caps.id, variant: '', jobId: null, tubeCount: 2, capCount: 3, items: caps.gate.map(g => g.id) })
  await until(() => !!store.find(runId), 'the run to show')
  return { store, runId }
}

describe('a procedure step', () => {
  it('records a confirmation only once it is ticked, then goes on', async () => {
    const { store, runId } = await runOnDevice()
    const step = steps.find(s => s.key === 'unplug')!
    const w = await mountSuspended(ProceduresStep, { props: { procedure: caps, run: store.find(runId)!, step, position: 1, total: steps.length } })
    expect(w.find('[data-testid="step-heading"]').text()).toBe(step.heading)
    const next = w.find('[data-testid="step-next"]')
    expect(next.text()).toBe('Done, go on')
    expect(next.attributes('disabled')).toBeDefined()
    expect(w.find('[data-testid="step-back"]').attributes('disabled')).toBeDefined()
    await w.find('[data-testid="step-confirm"]').trigger('click')
    expect(w.find('[data-testid="step-confirm"]').attributes('aria-checked')).toBe('true')
    expect(w.find('[data-testid="step-next"]').attributes('disabled')).toBeUndefined()
    await w.find('[data-testid="step-next"]').trigger('click')
    await until(() => !!w.emitted('next'), 'the step to go on')
    expect(store.find(runId)!.readings.unplug?.at).toMatch(/^\d{4}-/)
    expect(store.find(runId)!.stepIndex).toBe(1)
  })

  it('stops on a residual voltage above 50 V, says why, and clears it to measure again', async () => {
    const { store, runId } = await runOnDevice()
    const step = steps.find(s => s.key === 'verify:1')!
    const position = steps.indexOf(step) + 1
    const w = await mountSuspended(ProceduresStep, { props: { procedure: caps, run: store.find(runId)!, step, position, total: steps.length } })
    await w.find('[id="reading-verify:1"]').setValue('120')
    expect(w.find('[data-testid="step-next"]').text()).toBe('Record and go on')
    await w.find('[data-testid="step-next"]').trigger('click')
    await until(() => !!store.find(runId)!.readings['verify:1'], 'the reading to be kept')
    // The procedure's own 50 V limit, recalled in its definition (verify against local code), not a calculation.
    expect(store.find(runId)!.warnings.map(x => x.value)).toEqual([120])
    expect(w.emitted('next')).toBeUndefined()

    await w.setProps({ run: store.find(runId)! })
    const stop = w.find('[data-testid="step-stop"]')
    expect(stop.text()).toContain('Residual voltage: 120')
    expect(stop.text()).toContain('expected at most 50')
    expect(stop.text()).toContain('Still above 50 V')
    expect(w.find('[data-testid="step-next"]').exists()).toBe(false)
    await w.find('[data-testid="measure-again"]').trigger('click')
    await until(() => !store.find(runId)!.readings['verify:1'], 'the reading to clear')
    await w.setProps({ run: store.find(runId)! })
    expect(w.find('[data-testid="step-stop"]').exists()).toBe(false)
    expect(w.find('[id="reading-verify:1"]').exists()).toBe(true)
  })
})
