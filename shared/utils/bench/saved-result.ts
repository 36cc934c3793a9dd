import { computeTool } from './tool-compute'
import { isBenchToolId } from './tool-schemas'
import { ENGINE_VERSION } from './version'

export interface SavedToolResult {
  tool: unknown
  inputs: unknown
  outputs: unknown
  engineVersion: unknown
}

export type SavedResultVerdict = { ok: true } | { ok: false, reason: string }

export const VERIFY_RELATIVE_TOLERANCE = 1e-9
// Only for outputs that are zero by construction (equal readings, no spread).
export const VERIFY_ZERO_TOLERANCE = 1e-15

function majorOf(version: string): number | undefined {
  const match = /^(\d+)\.\d+\.\d+$/.exec(version)
  return match ? Number(match[1]) : undefined
}

function numbersMatch(expected: number, actual: number): boolean {
  if (!Number.isFinite(actual)) return false
  if (Math.abs(expected) <= VERIFY_ZERO_TOLERANCE && Math.abs(actual) <= VERIFY_ZERO_TOLERANCE) return true
  const scale = Math.max(Math.abs(expected), Math.abs(actual))
  return Math.abs(expected - actual) <= VERIFY_RELATIVE_TOLERANCE * scale
}

function isPlainObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value)
}

/** First place where actual departs from expected, or undefined when they match. */
function firstMismatch(expected: unknown, actual: unknown, path: string): string | undefined {
  if (typeof expected === 'number') {
    return typeof actual === 'number' && numbersMatch(expected, actual)
      ? undefined
      : `${path} does not match its inputs (saved ${JSON.stringify(actual)}, recomputed ${expected})`
  }
  if (Array.isArray(expected)) {
    if (!Array.isArray(actual) || actual.length !== expected.length) return `${path} does not match its inputs`
    for (let k = 0; k < expected.length; k++) {
      const found = firstMismatch(expected[k], actual[k], `${path}[${k}]`)
      if (found) return found
    }
    return undefined
  }
  if (isPlainObject(expected)) {
    if (!isPlainObject(actual)) return `${path} does not match its inputs`
    for (const key of Object.keys(actual)) {
      if (!(key in expected)) return `${path}.${key} is not an output of this tool`
    }
    for (const key of Object.keys(expected)) {
      if (!(key in actual)) return `${path}.${key} is missing`
      const found = firstMismatch(expected[key], actual[key], `${path}.${key}`)
      if (found) return found
    }
    return undefined
  }
  return expected === actual ? undefined : `${path} does not match its inputs`
}

/** Recomputes a saved result so the server can refuse outputs that its inputs do not produce. */
export function verifySavedResult(saved: SavedToolResult): SavedResultVerdict {
  const { tool, inputs, outputs, engineVersion } = saved
  if (!isBenchToolId(tool)) return { ok: false, reason: `unknown bench tool ${JSON.stringify(tool)}` }
  if (typeof engineVersion !== 'string' || majorOf(engineVersion) === undefined) {
    return { ok: false, reason: 'engineVersion must be a version like 1.0.0' }
  }
  if (majorOf(engineVersion) !== majorOf(ENGINE_VERSION)) {
    return { ok: false, reason: `saved with engine ${engineVersion}; this engine is ${ENGINE_VERSION}` }
  }
  let expected: unknown
  try {
    expected = computeTool(tool, inputs)
  }
  catch (error) {
    return { ok: false, reason: `inputs rejected: ${error instanceof Error ? error.message : String(error)}` }
  }
  const mismatch = firstMismatch(expected, outputs, 'outputs')
  return mismatch === undefined ? { ok: true } : { ok: false, reason: mismatch }
}
