import type { BenchToolId } from '../utils/bench/index'

/** Where a saved bench result belongs. */
export type MeasurementAttach =
  | { kind: 'notebook' }
  | { kind: 'job', id: string }
  | { kind: 'rig', id: string }

export interface NewMeasurement {
  tool: BenchToolId
  inputs: unknown
  outputs: unknown
  label?: string
  attach: MeasurementAttach
}
