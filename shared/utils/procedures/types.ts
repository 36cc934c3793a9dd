import type { BenchToolId } from '../bench/tool-schemas'
import type { Dimension } from '../units'
import type { Role } from '../roles'

/** One hazard the person running the procedure acknowledges before step 1. */
export interface GateItem {
  id: string
  text: string
}

/** A reading outside it stops the run: the person sees the reason and measures again or ends the run. */
export interface ExpectedRange {
  min?: number
  max?: number
  reason: string
}

export interface StepTool {
  id: BenchToolId
  /** Form choices set for this step (the tool's own form keys, as text). */
  presets?: Record<string, string>
  /** Extra presets for one variant (the transformer method reads a different input). */
  variantPresets?: Record<string, Record<string, string>>
  /** Form fields emptied when the step opens, so one tube's reading is never recorded for the next. */
  fresh?: readonly string[]
  /** Form fields filled from an earlier step's reading (same repeat index when both repeat). */
  fromReadings?: Record<string, string>
  /** The output this step records: a key of the tool's outputs, or `sets.length`. */
  record: { output: string, label: string, dimension: Dimension, /** Multiplies the output into SI (percent -> fraction). */ factor?: number }
}

export interface ProcedureStep {
  id: string
  title: string
  instruction: string
  caution?: { level: 'caution' | 'danger', text: string }
  /** Only in this variant (e.g. the sense-resistor method). */
  only?: string
  /** Done once per power tube, or once per filter capacitor. */
  repeat?: 'tube' | 'cap'
  tool?: StepTool
  /** A number read off a meter and typed in. */
  reading?: { label: string, dimension: Dimension, unit: string }
  expect?: ExpectedRange
  /** Wait before the step can be marked done. `fromStep` lengthens it to that step's reading in seconds. */
  hold?: { seconds: number, reason: string, fromStep?: string }
  /** For a step with no reading: what the person confirms by marking it done. */
  confirm?: string
}

export interface ProcedureVariant {
  id: string
  label: string
  note: string
}

export interface ProcedureDefinition {
  id: string
  title: string
  summary: string
  /** Work inside the chassis, near B+: never for players. */
  insideChassis: boolean
  roles: readonly Role[]
  gate: readonly GateItem[]
  variants?: readonly ProcedureVariant[]
  steps: readonly ProcedureStep[]
}

/** A step as run: repeats expanded, so `key` is unique within the run ("measure-final:2"). */
export interface RunStep extends ProcedureStep {
  key: string
  /** 1-based tube or capacitor number for a repeated step. */
  index?: number
  heading: string
}

/** What was recorded for one run step. */
export interface StepReading {
  /** In SI units of the step's dimension (percent for %). Absent for a confirm-only step. */
  value?: number
  measurementId?: string
  at: string
}

export interface RunCounts {
  tubes: number
  caps: number
}
