// An oracle for the engine tests that shares no code with the engine: a general-purpose maths
// library with physical units (mathjs, from the npm registry). Where it can, it works from a
// definition (a sampled sine, a complex transfer function, a numerically solved differential
// equation) rather than from the closed-form formula the engine uses, so a wrong formula in the
// engine cannot be reproduced here by the same slip.
import { all, create } from 'mathjs'

const math = create(all!, { number: 'number' })
// The typings lag the library: solveODE ships in mathjs but is missing from MathJsInstance.
const solveODE = (math as unknown as { solveODE: (f: (t: number, y: number[]) => number[], span: number[], y0: number[], options: object) => { y: number[][] } }).solveODE

/** Evaluates an expression with units and returns its value in `unit` ("mA", "W", "Hz"). */
export function inUnit(expression: string, unit: string): number {
  const result = math.evaluate(`(${expression}) to ${unit}`) as { toNumber(u: string): number }
  return result.toNumber(unit)
}

/** A plain number from a dimensionless expression ("8 kohm / 8 ohm"). */
export function ratio(expression: string): number {
  const result = math.evaluate(expression) as unknown
  if (typeof result === 'number') return result
  // A ratio of units that mathjs keeps as a unit (kohm / ohm): reduce to a bare number.
  return (result as { toNumber(u: string): number }).toNumber('')
}

const SAMPLES = 3600

/** One period of a sine of the given peak-to-peak voltage, sampled evenly. */
function sine(peakToPeak: number): number[] {
  return math.range(0, SAMPLES).toArray().map(k => (peakToPeak / 2) * math.sin((2 * math.pi * Number(k)) / SAMPLES))
}

/** RMS of a sampled sine: √(mean(v²)), from the definition of RMS, not from 2√2. */
export function sampledSineRms(peakToPeak: number): number {
  return math.sqrt(math.mean(math.dotPow(sine(peakToPeak), 2)) as number) as number
}

/** Mean power of a sampled sine into a resistor: mean(v²/R). */
export function sampledSinePower(peakToPeak: number, ohms: number): number {
  return math.mean(sine(peakToPeak).map(v => (v * v) / ohms)) as number
}

/** Peak of a sine whose sampled RMS is `rms`: scale a unit sine until its RMS matches. */
export function sampledPeakForRms(rms: number): number {
  return rms / sampledSineRms(2)
}

/** |H(f)| of a first-order RC high-pass, H = jωRC / (1 + jωRC), in complex arithmetic. */
export function highPassGain(hz: number, ohms: number, farads: number): number {
  const jwrc = math.complex(0, 2 * math.pi * hz * ohms * farads)
  return math.abs(math.divide(jwrc, math.add(1, jwrc)) as typeof jwrc) as unknown as number
}

/** Capacitor voltage after `seconds` through a resistor, by solving C·dV/dt = −V/R numerically. */
export function solvedDischarge(v0: number, seconds: number, farads: number, ohms: number): number {
  const { y } = solveODE((_t, v) => [-v[0]! / (ohms * farads)], [0, seconds], [v0], { tol: 1e-9 })
  return y[y.length - 1]![0]!
}

/** Energy stored in a capacitor from W = ∫ V dq, by the trapezoid rule over its charge. */
export function integratedCapEnergy(farads: number, volts: number): number {
  const steps = 1000
  const charge = farads * volts
  const dq = charge / steps
  const v = math.range(0, steps + 1).toArray().map(k => (Number(k) * dq) / farads)
  return dq * ((math.sum(v) as number) - (v[0]! + v[steps]!) / 2)
}

/** Impedance the primary of an ideal transformer presents: drive 100 V, follow V and I through n. */
export function idealTransformerPrimaryOhms(secondaryOhms: number, turnsRatio: number): number {
  const primaryVolts = 100
  const secondaryVolts = primaryVolts / turnsRatio
  const secondaryAmps = secondaryVolts / secondaryOhms
  const primaryAmps = secondaryAmps / turnsRatio
  return inUnit(`${primaryVolts} V / ${primaryAmps} A`, 'ohm')
}

/** Exact rational check of "largest ≤ (1 + tolerance) × smallest", for readings in whole microamps. */
export function exactlyWithin(smallestMicroamps: number, largestMicroamps: number, tolerancePercent: number): boolean {
  const spread = math.subtract(math.fraction(largestMicroamps, smallestMicroamps), 1)
  return math.compare(spread, math.fraction(tolerancePercent, 100)) as unknown as number <= 0
}
