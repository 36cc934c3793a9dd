import { requirePositive } from './guards'

export function reflectedImpedance(secondaryOhms: number, turnsRatio: number): number {
  requirePositive('secondaryOhms', secondaryOhms)
  requirePositive('turnsRatio', turnsRatio)
  return secondaryOhms * turnsRatio * turnsRatio
}

export function turnsRatioForImpedances(primaryOhms: number, secondaryOhms: number): number {
  requirePositive('primaryOhms', primaryOhms)
  requirePositive('secondaryOhms', secondaryOhms)
  return Math.sqrt(primaryOhms / secondaryOhms)
}
