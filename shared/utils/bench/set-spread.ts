import { requirePositive } from './guards'

/**
 * A matched set's spread: highest idle current over lowest, minus one (0.05 is "within 5 %").
 * The same measure the Tube sorter matches with (`withinTolerance`), so a saved set reads as the
 * sorter showed it.
 */
export function setSpread(amps: readonly number[]): number {
  if (!Array.isArray(amps) || amps.length < 2) throw new RangeError('amps must list at least two readings')
  amps.forEach((a, i) => requirePositive(`amps[${i}]`, a))
  return Math.max(...amps) / Math.min(...amps) - 1
}

/** The set's mean idle current (A). */
export function setMeanAmps(amps: readonly number[]): number {
  if (!Array.isArray(amps) || amps.length < 1) throw new RangeError('amps must list at least one reading')
  amps.forEach((a, i) => requirePositive(`amps[${i}]`, a))
  return amps.reduce((s, a) => s + a, 0) / amps.length
}

/** A stored spread agrees with the readings (sent by a device, recomputed by the server). */
export const spreadAgrees = (stored: number, amps: readonly number[]) => Math.abs(stored - setSpread(amps)) <= 1e-9
