// A rig's readings: the latest per position with its idle band, and the history as series for a chart.
import { dissipationPercent, idleBand, plateDissipation, type BiasMode, type IdleBand } from '../bench/dissipation'
import { findBuiltinTube } from '../tubes/builtin'
import type { RigReading, RigTube } from './types'

export interface ReadingBand { percent: number, band: IdleBand }

/**
 * The idle band of one reading: plate volts (to cathode) times current against the tube type's
 * plate rating. Null when no plate volts were taken or the type is not in the built-in list.
 */
export function readingBand(r: Pick<RigReading, 'mA' | 'plateVolts'>, tubeType: string, mode: BiasMode): ReadingBand | null {
  if (r.plateVolts === null) return null
  const tube = findBuiltinTube(tubeType.trim().toLowerCase())
  if (!tube) return null
  const percent = dissipationPercent(plateDissipation(r.plateVolts, r.mA / 1000), tube.maxPlateWatts)
  return { percent, band: idleBand(percent, mode) }
}

/** The newest reading of each position (by date; a later entry wins a tie). */
export function latestReadings(readings: readonly RigReading[]): RigReading[] {
  const last = new Map<string, RigReading>()
  for (const r of readings) {
    const seen = last.get(r.position)
    if (!seen || r.on >= seen.on) last.set(r.position, r)
  }
  return [...last.values()].sort((a, b) => a.position.localeCompare(b.position, 'en', { numeric: true }))
}

export interface Series { position: string, points: { on: string, mA: number }[] }

/** mA over time, one series per position, oldest first. */
export function readingSeries(readings: readonly RigReading[]): Series[] {
  const by = new Map<string, { on: string, mA: number }[]>()
  for (const r of readings) by.set(r.position, [...(by.get(r.position) ?? []), { on: r.on, mA: r.mA }])
  return [...by.entries()].sort(([a], [b]) => a.localeCompare(b, 'en', { numeric: true }))
    .map(([position, points]) => ({ position, points: points.sort((a, b) => a.on.localeCompare(b.on)) }))
}

/** The tube type in a position, from the set's tubes or else the rig's complement. */
export const typeAt = (position: string, ...lists: readonly (readonly RigTube[])[]) =>
  lists.flat().find(t => t.position === position)?.type ?? ''
