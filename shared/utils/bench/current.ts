import { requireFraction, requirePositive, requireWholeAtLeast } from './guards'

export function currentFromSenseResistor(volts: number, ohms: number): number {
  requirePositive('volts', volts)
  requirePositive('ohms', ohms)
  return volts / ohms
}

/** Ohms measured cold across one half of the primary; the drop is read live. */
export function currentFromPrimaryDrop(volts: number, halfPrimaryOhms: number): number {
  requirePositive('volts', volts)
  requirePositive('halfPrimaryOhms', halfPrimaryOhms)
  return volts / halfPrimaryOhms
}

/** Assumes the tubes sharing one resistor draw equal current. */
export function cathodeCurrentPerTube(
  cathodeVolts: number,
  cathodeOhms: number,
  tubesSharing: number,
): number {
  requirePositive('cathodeVolts', cathodeVolts)
  requirePositive('cathodeOhms', cathodeOhms)
  requireWholeAtLeast('tubesSharing', tubesSharing, 1)
  return cathodeVolts / cathodeOhms / tubesSharing
}

/** Cathode current is plate plus screen; screenFraction is the screen's share of it. */
export function plateCurrentFromCathode(cathodeAmps: number, screenFraction: number): number {
  requirePositive('cathodeAmps', cathodeAmps)
  requireFraction('screenFraction', screenFraction)
  return cathodeAmps * (1 - screenFraction)
}
