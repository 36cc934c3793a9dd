import { computeTool, parseToolInputs } from '#shared/utils/bench/index'
import type { BenchToolId, BenchToolInputs, BenchToolOutputs } from '#shared/utils/bench/index'
import { readQuantity, type Dimension } from '#shared/utils/units'
import { engineMessageInWords } from '~/utils/engine-words'

/** One input as the form holds it: typed text and its unit, or a value picked elsewhere (a tube). */
export interface BenchField {
  label: string
  dimension: Dimension
  text?: string
  unit?: string
  value?: number
  optional?: boolean
}

export interface BenchComputeState<T extends BenchToolId> {
  /** Messages to show beside a field, by field key. */
  errors: Record<string, string>
  /** Labels of required fields still empty. */
  missing: string[]
  /** A problem that names no field on the form. */
  error: string
  inputs: BenchToolInputs[T] | null
  outputs: BenchToolOutputs[T] | null
}

export type BenchValues = Record<string, number>
export type BenchUnits = Record<string, string | null>

function escape(s: string) {
  return s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}

// Engine messages start with the input's name ("plateVolts must be ..."): say it in the form's words.
function humanise(message: string, fields: Record<string, BenchField>): string {
  let out = message
  for (const [key, f] of Object.entries(fields)) {
    out = out.replace(new RegExp(`(^|\\s)${escape(key)}(?=[\\s.:\\[]|$)`, 'g'), (_m, lead: string) =>
      lead === '' ? f.label : `${lead}${f.label.toLowerCase()}`)
  }
  return out
}

function fieldNamed(message: string, keys: string[]): string | undefined {
  const first = message.split(/[\s:.[]/)[0] ?? ''
  return keys.find(k => k === first)
}

/**
 * Reads every field, builds the engine inputs and computes live. Nothing is computed
 * while a required field is empty or a field cannot be read.
 */
export function useBenchCompute<T extends BenchToolId>(
  tool: T,
  fields: () => Record<string, BenchField>,
  build: (values: BenchValues, units: BenchUnits) => unknown,
) {
  return computed<BenchComputeState<T>>(() => {
    const all = fields()
    const values: BenchValues = {}
    const units: BenchUnits = {}
    const errors: Record<string, string> = {}
    const missing: string[] = []
    for (const [key, f] of Object.entries(all)) {
      if (f.value !== undefined) {
        values[key] = f.value
        continue
      }
      const r = readQuantity(f.text ?? '', { defaultUnit: f.unit, dimension: f.dimension })
      if (r.ok) {
        values[key] = r.value
        units[key] = r.unit
      }
      else if (!r.empty) errors[key] = `${f.label}: ${r.error}`
      else if (!f.optional) missing.push(f.label)
    }
    const empty = { errors, missing, error: '', inputs: null, outputs: null }
    if (missing.length || Object.keys(errors).length) return empty
    try {
      const inputs = parseToolInputs(tool, build(values, units))
      return { ...empty, inputs, outputs: computeTool(tool, inputs) }
    }
    catch (e) {
      if (!(e instanceof RangeError)) throw e
      const message = engineMessageInWords(humanise(e.message, all))
      const key = fieldNamed(e.message, Object.keys(all))
      if (key) return { ...empty, errors: { [key]: message } }
      return { ...empty, error: message }
    }
  })
}
