import { describe, expect, it } from 'vitest'
import { runSoak } from './helpers/soak'

describe('convergence soak (3 devices, lossy network)', () => {
  it('delivers every change exactly once and ends with every device equal to the server', async () => {
    // npm test runs a smaller count; `npm run soak` runs the full 2,000.
    const mutations = Number(process.env.TW_SOAK_MUTATIONS ?? 400)
    const r = await runSoak({ clients: 3, mutations, seed: 20261201 })
    console.log('soak:', JSON.stringify(r))
    expect(r.converged).toBe(true)
    expect(r.rounds).toBeLessThanOrEqual(3)
    expect(r.loggedUuids).toBe(mutations)
    expect(r.duplicateRows).toBe(0)
    expect(r.notesOnServer).toBe(r.noteCreatesApplied)
    expect(r.outboxLeft).toBe(0)
    expect(r.conflictsWithLosingValue).toBe(r.conflicts)
    // The run really exercised conflicts and killed tabs.
    expect(r.conflicts).toBeGreaterThan(0)
    expect(r.restarts).toBeGreaterThan(0)
  }, 240_000)
})
