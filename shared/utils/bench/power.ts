import { requirePositive } from './guards'

/** Sine wave only: Vrms = Vpp / (2√2). */
export function peakToPeakToRms(vpp: number): number {
  requirePositive('vpp', vpp)
  return vpp / (2 * Math.SQRT2)
}

export function rmsPower(vrms: number, loadOhms: number): number {
  requirePositive('vrms', vrms)
  requirePositive('loadOhms', loadOhms)
  return (vrms * vrms) / loadOhms
}

export function cleanPowerFromPeakToPeak(vpp: number, loadOhms: number): number {
  return rmsPower(peakToPeakToRms(vpp), loadOhms)
}

export function powerRatioDb(p2: number, p1: number): number {
  requirePositive('p2', p2)
  requirePositive('p1', p1)
  return 10 * Math.log10(p2 / p1)
}
