import { requireNonNegative, requirePositive } from './guards'

export function rcCornerHz(ohms: number, farads: number): number {
  requirePositive('ohms', ohms)
  requirePositive('farads', farads)
  return 1 / (2 * Math.PI * ohms * farads)
}

export function capacitanceForCorner(ohms: number, hz: number): number {
  requirePositive('ohms', ohms)
  requirePositive('hz', hz)
  return 1 / (2 * Math.PI * ohms * hz)
}

export function capVoltageAfter(v0: number, seconds: number, farads: number, ohms: number): number {
  requirePositive('v0', v0)
  requireNonNegative('seconds', seconds)
  requirePositive('farads', farads)
  requirePositive('ohms', ohms)
  return v0 * Math.exp(-seconds / (ohms * farads))
}

export function capDrainSeconds(v0: number, vTarget: number, farads: number, ohms: number): number {
  requirePositive('v0', v0)
  // An exponential never reaches zero, so the target must be a positive level.
  requirePositive('vTarget', vTarget)
  if (vTarget >= v0) throw new RangeError('vTarget must be below v0')
  requirePositive('farads', farads)
  requirePositive('ohms', ohms)
  return ohms * farads * Math.log(v0 / vTarget)
}

export function capEnergyJoules(farads: number, volts: number): number {
  requirePositive('farads', farads)
  requireNonNegative('volts', volts)
  return 0.5 * farads * volts * volts
}
