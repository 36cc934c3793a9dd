import { requireNonNegative, requirePositive } from './guards'

export interface BiasSupplyInputs {
  tapVoltsRms: number
  diodeDropVolts: number
  topOhms: number
  potOhms: number
  bottomOhms: number
}

export interface BiasSupplyRange {
  dcVolts: number
  leastNegativeVolts: number
  mostNegativeVolts: number
}

/** Unloaded half-wave peak; a real supply under load sits a little less negative. */
export function biasSupplyRange(inputs: BiasSupplyInputs): BiasSupplyRange {
  const { tapVoltsRms, diodeDropVolts, topOhms, potOhms, bottomOhms } = inputs
  requirePositive('tapVoltsRms', tapVoltsRms)
  requireNonNegative('diodeDropVolts', diodeDropVolts)
  requireNonNegative('topOhms', topOhms)
  requirePositive('potOhms', potOhms)
  requirePositive('bottomOhms', bottomOhms)
  const peak = tapVoltsRms * Math.SQRT2
  if (diodeDropVolts >= peak) {
    throw new RangeError('diodeDropVolts must be below the tap peak voltage')
  }
  const dcVolts = -(peak - diodeDropVolts)
  const total = topOhms + potOhms + bottomOhms
  return {
    dcVolts,
    leastNegativeVolts: (dcVolts * bottomOhms) / total,
    mostNegativeVolts: (dcVolts * (bottomOhms + potOhms)) / total,
  }
}
