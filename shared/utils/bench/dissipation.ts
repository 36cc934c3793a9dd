import { requireFinite, requireNonNegative, requirePositive } from './guards'

export type BiasMode = 'fixed' | 'cathode'
export type IdleBand = 'cold' | 'in range' | 'warm' | 'over'

/** Percent of rating: below inRangeFrom is cold, up to inRangeTo in range, up to overAbove warm, beyond that over. */
export interface IdleBandThresholds {
  inRangeFrom: number
  inRangeTo: number
  overAbove: number
}

// Common practice, no single source; shops may override per call.
export const DEFAULT_IDLE_BANDS: Readonly<Record<BiasMode, Readonly<IdleBandThresholds>>> = Object.freeze({
  fixed: Object.freeze({ inRangeFrom: 50, inRangeTo: 70, overAbove: 100 }),
  cathode: Object.freeze({ inRangeFrom: 70, inRangeTo: 95, overAbove: 100 }),
})

export function plateDissipation(plateToCathodeVolts: number, plateAmps: number): number {
  requirePositive('plateToCathodeVolts', plateToCathodeVolts)
  requirePositive('plateAmps', plateAmps)
  return plateToCathodeVolts * plateAmps
}

export function dissipationPercent(watts: number, maxWatts: number): number {
  requireNonNegative('watts', watts)
  requirePositive('maxWatts', maxWatts)
  return (watts / maxWatts) * 100
}

export function requireBiasMode(mode: unknown): BiasMode {
  if (mode !== 'fixed' && mode !== 'cathode') {
    throw new RangeError("mode must be 'fixed' or 'cathode'")
  }
  return mode
}

export function resolveIdleBandThresholds(
  mode: BiasMode,
  thresholds?: IdleBandThresholds,
): IdleBandThresholds {
  requireBiasMode(mode)
  if (thresholds === undefined) return DEFAULT_IDLE_BANDS[mode]
  const { inRangeFrom, inRangeTo, overAbove } = thresholds
  requireNonNegative('thresholds.inRangeFrom', inRangeFrom)
  requirePositive('thresholds.inRangeTo', inRangeTo)
  requirePositive('thresholds.overAbove', overAbove)
  if (!(inRangeFrom <= inRangeTo && inRangeTo <= overAbove)) {
    throw new RangeError('thresholds must satisfy inRangeFrom <= inRangeTo <= overAbove')
  }
  return thresholds
}

export function idleBand(percent: number, mode: BiasMode, thresholds?: IdleBandThresholds): IdleBand {
  requireFinite('percent', percent)
  const t = resolveIdleBandThresholds(mode, thresholds)
  if (percent < t.inRangeFrom) return 'cold'
  if (percent <= t.inRangeTo) return 'in range'
  if (percent <= t.overAbove) return 'warm'
  return 'over'
}

export function idleCurrentForPercent(
  plateToCathodeVolts: number,
  maxWatts: number,
  percent: number,
): number {
  requirePositive('plateToCathodeVolts', plateToCathodeVolts)
  requirePositive('maxWatts', maxWatts)
  requirePositive('percent', percent)
  return (maxWatts * percent) / 100 / plateToCathodeVolts
}
