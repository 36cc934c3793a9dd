import { requirePositive, requireWholeAtLeast } from './guards'

export interface CathodeResistorSizing {
  ohms: number
  watts: number
  minRatingWatts: number
}

// Rating at twice the dissipation: common practice, no source.
const RATING_FACTOR = 2

export function cathodeResistorFor(
  cathodeVolts: number,
  cathodeAmpsPerTube: number,
  tubesSharing: number,
): CathodeResistorSizing {
  requirePositive('cathodeVolts', cathodeVolts)
  requirePositive('cathodeAmpsPerTube', cathodeAmpsPerTube)
  requireWholeAtLeast('tubesSharing', tubesSharing, 1)
  const ohms = cathodeVolts / (tubesSharing * cathodeAmpsPerTube)
  const watts = (cathodeVolts * cathodeVolts) / ohms
  return { ohms, watts, minRatingWatts: RATING_FACTOR * watts }
}
