import { defineStore } from 'pinia'
import { findProcedure, gateComplete, mayRun, validVariant } from '#shared/utils/procedures/index'
import type { StepReading } from '#shared/utils/procedures/index'
import type { EntityFields } from '#shared/utils/sync/entities'
import type { ProcedureGateRecord, ProcedureRunRecord } from '#shared/types/records'

export type RunRow = ProcedureRunRecord
export type GateRow = ProcedureGateRecord

export interface RunStart {
  procedureId: string
  variant: string
  jobId: string | null
  tubeCount: number
  capCount: number
  /** Ids of the gate items ticked, one by one. */
  items: string[]
}

/** Procedure runs and their safety checks, on the device first; the server refuses a run without its check. */
export const useProceduresStore = defineStore('procedures', () => {
  const sync = useSyncStore()
  const session = useSessionStore()
  const runTable = useEntityTable('procedureRuns', { noun: 'run', order: newestFirst })
  const gateTable = useEntityTable('procedureGates', { noun: 'safety check' })

  const runs = runTable.all
  const loaded = computed(() => runTable.loaded.value && gateTable.loaded.value)
  const mine = computed(() => runs.value.filter(r => r.createdBy === session.user?.id))
  const unfinished = computed(() => mine.value.filter(r => r.status === 'running'))

  /** The run's own acknowledged safety check, if this device has it. */
  function gateOf(run: Pick<RunRow, 'id' | 'gateId' | 'procedureId'>): GateRow | undefined {
    const gate = gateTable.byId(run.gateId)
    const procedure = findProcedure(run.procedureId)
    if (!gate || !procedure || gate.runId !== run.id || !gateComplete(procedure, gate.items)) return undefined
    return gate
  }

  /** Straight from the device database: the lists above may lag a write by a moment. */
  async function hasGatedRun(runId: string): Promise<boolean> {
    const run = await sync.db?.procedureRuns.get(runId)
    if (!run || run.deleted) return false
    const gate = await sync.db?.procedureGates.get(run.gateId)
    const procedure = findProcedure(run.procedureId)
    return !!gate && !!procedure && gate.runId === run.id && gateComplete(procedure, gate.items)
  }

  async function start(s: RunStart): Promise<string> {
    const procedure = findProcedure(s.procedureId)
    if (!procedure) throw new Error('That procedure does not exist.')
    if (!session.role || !mayRun(procedure, session.role)) throw new Error('Your role may not run this procedure.')
    if (!validVariant(procedure, s.variant)) throw new Error('Choose how you will measure.')
    if (!gateComplete(procedure, s.items)) throw new Error('Tick every item of the safety check first.')
    const runId = crypto.randomUUID()
    // The check goes first: the server takes a run only with its check already in place.
    const gateId = await gateTable.create({ runId, procedureId: s.procedureId, jobId: s.jobId, items: s.items, acknowledgedAt: new Date().toISOString() })
    await runTable.create({ procedureId: s.procedureId, gateId, variant: s.variant, jobId: s.jobId, tubeCount: s.tubeCount, capCount: s.capCount }, runId)
    return runId
  }

  const change = (runId: string, fields: Partial<EntityFields<'procedureRuns'>>) => runTable.edit(runId, fields)

  /** Record a step as done (with its reading, if any) and move the run on to `nextIndex`. */
  async function record(run: RunRow, stepKey: string, reading: StepReading, nextIndex: number) {
    await change(run.id, { readings: { ...run.readings, [stepKey]: reading }, stepIndex: Math.max(run.stepIndex, nextIndex) })
  }

  /** A reading outside its range: keep it, note the warning, and stay on the step. */
  async function stopAt(run: RunRow, stepKey: string, reading: StepReading, reason: string) {
    await change(run.id, {
      readings: { ...run.readings, [stepKey]: reading },
      // The record keeps the latest 200 warnings (its limit); a run that long has said enough.
      warnings: [...run.warnings, { step: stepKey, text: reason, ...(reading.value === undefined ? {} : { value: reading.value }), at: reading.at }].slice(-200),
    })
  }

  async function clearReading(run: RunRow, stepKey: string) {
    const { [stepKey]: _gone, ...rest } = run.readings
    await change(run.id, { readings: rest })
  }

  async function finish(run: RunRow) {
    await change(run.id, { status: 'done', endedAt: new Date().toISOString() })
  }

  async function end(run: RunRow, reason: string) {
    await change(run.id, { status: 'stopped', endedAt: new Date().toISOString(), endReason: reason.slice(0, 500) })
  }

  return { runs, loaded, mine, unfinished, find: runTable.byId, forJob: runTable.forJob, gateOf, hasGatedRun, start, record, stopAt, clearReading, finish, end }
})
