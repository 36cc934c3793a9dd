// What a run of a procedure is made of, and whether it may finish: shared by the run screen and the server.
import type { Role } from '../roles'
import type { ExpectedRange, ProcedureDefinition, RunCounts, RunStep, StepReading } from './types'

export const MAX_REPEAT = 16

/** Can this role run it at all? Players only run what stays outside the chassis. */
export function mayRun(procedure: ProcedureDefinition, role: Role): boolean {
  if (role === 'player' && procedure.insideChassis) return false
  return procedure.roles.includes(role)
}

/** The steps of one run: the chosen variant's steps, repeated steps once per tube or capacitor. */
export function expandSteps(procedure: ProcedureDefinition, variant: string | undefined, counts: RunCounts): RunStep[] {
  const chosen = variant || procedure.variants?.[0]?.id
  const out: RunStep[] = []
  for (const step of procedure.steps) {
    if (step.only && step.only !== chosen) continue
    if (!step.repeat) {
      out.push({ ...step, key: step.id, heading: step.title })
      continue
    }
    const n = step.repeat === 'tube' ? counts.tubes : counts.caps
    const noun = step.repeat === 'tube' ? 'tube' : 'capacitor'
    for (let i = 1; i <= n; i++) out.push({ ...step, key: `${step.id}:${i}`, index: i, heading: `${step.title}: ${noun} ${i} of ${n}` })
  }
  return out
}

/** Is the variant one this procedure offers? '' means its first (or, without variants, none). */
export function validVariant(procedure: ProcedureDefinition, variant: string): boolean {
  if (variant === '') return true
  return !!procedure.variants?.some(v => v.id === variant)
}

/** A gate is acknowledged when every one of its items was ticked (extra ids are not hazards of this procedure). */
export function gateComplete(procedure: ProcedureDefinition, ticked: readonly string[]): boolean {
  const set = new Set(ticked)
  return procedure.gate.every(item => set.has(item.id)) && ticked.every(id => procedure.gate.some(item => item.id === id))
}

export type RangeVerdict = { ok: true } | { ok: false, reason: string, side: 'low' | 'high' }

export function checkRange(range: ExpectedRange | undefined, value: number | undefined): RangeVerdict {
  if (!range || value === undefined) return { ok: true }
  if (range.min !== undefined && value < range.min) return { ok: false, reason: range.reason, side: 'low' }
  if (range.max !== undefined && value > range.max) return { ok: false, reason: range.reason, side: 'high' }
  return { ok: true }
}

/** Whether the step needs a number before it can be marked done. */
export const needsValue = (step: RunStep) => !!(step.tool || step.reading)

/** The step's hold in seconds: its own, or longer when it takes its length from an earlier reading. */
export function holdSeconds(step: RunStep, readings: Record<string, StepReading>): number {
  if (!step.hold) return 0
  const from = step.hold.fromStep ? readings[step.hold.fromStep]?.value : undefined
  return Math.ceil(Math.max(step.hold.seconds, from ?? 0))
}

export interface RunEvaluation {
  steps: { step: RunStep, reading?: StepReading, verdict: RangeVerdict }[]
  /** Steps with no reading yet (or with no value where one is needed). */
  missing: RunStep[]
  outOfRange: { step: RunStep, reason: string }[]
  /** Every step done and every reading inside its range. */
  canFinish: boolean
}

export function evaluateRun(procedure: ProcedureDefinition, variant: string, counts: RunCounts, readings: Record<string, StepReading>): RunEvaluation {
  const steps = expandSteps(procedure, variant, counts).map((step) => {
    const reading = readings[step.key]
    return { step, reading, verdict: checkRange(step.expect, reading?.value) }
  })
  const missing = steps.filter(s => !s.reading || (needsValue(s.step) && typeof s.reading.value !== 'number')).map(s => s.step)
  const outOfRange = steps.flatMap(s => (s.verdict.ok ? [] : [{ step: s.step, reason: s.verdict.reason }]))
  return { steps, missing, outOfRange, canFinish: missing.length === 0 && outOfRange.length === 0 }
}

/** Reads `percent` or `sets.length` out of a tool's outputs. */
export function readOutput(outputs: unknown, path: string): number | undefined {
  let v: unknown = outputs
  for (const part of path.split('.')) {
    if (v === null || typeof v !== 'object') return undefined
    v = (v as Record<string, unknown>)[part]
  }
  return typeof v === 'number' && Number.isFinite(v) ? v : undefined
}

/** The tool form values a step opens with: its choices, values carried from earlier readings, fresh fields emptied. */
export function toolPresets(procedure: ProcedureDefinition, step: RunStep, variant: string, readings: Record<string, StepReading>): Record<string, string> {
  const tool = step.tool
  if (!tool) return {}
  const chosen = variant || procedure.variants?.[0]?.id || ''
  const out: Record<string, string> = { ...tool.presets, ...tool.variantPresets?.[chosen] }
  for (const key of tool.fresh ?? []) out[key] = ''
  for (const [field, fromId] of Object.entries(tool.fromReadings ?? {})) {
    const from = procedure.steps.find(s => s.id === fromId)
    const reading = readings[step.index && from?.repeat ? `${fromId}:${step.index}` : fromId]
    if (!from?.reading || typeof reading?.value !== 'number') continue
    out[field] = String(reading.value)
    out[`${field}Unit`] = from.reading.unit
  }
  return out
}
