import { z } from 'zod'

import type { BenchToolId } from './tool-ids'

export { BENCH_TOOL_IDS, isBenchToolId, type BenchToolId } from './tool-ids'

// Messages name the field so the UI can show them beside it unchanged.
const positive = (name: string) => {
  const error = `${name} must be a positive number`
  return z.number({ error }).positive({ error })
}
const nonNegative = (name: string) => {
  const error = `${name} must be a non-negative number`
  return z.number({ error }).min(0, { error })
}
const negative = (name: string) => {
  const error = `${name} must be a negative number`
  return z.number({ error }).negative({ error })
}
const fraction = (name: string) => {
  const error = `${name} must be a fraction from 0 up to (not including) 1`
  return z.number({ error }).min(0, { error }).lt(1, { error })
}
const wholeAtLeast = (name: string, min: number) => {
  const error = `${name} must be a whole number of at least ${min}`
  return z.number({ error }).int({ error }).min(min, { error })
}

export const biasModeSchema = z.enum(['fixed', 'cathode'], { error: "mode must be 'fixed' or 'cathode'" })

export const idleBandThresholdsSchema = z
  .object({
    inRangeFrom: positive('bandThresholds.inRangeFrom'),
    inRangeTo: positive('bandThresholds.inRangeTo'),
    overAbove: positive('bandThresholds.overAbove'),
  })
  .refine(t => t.inRangeFrom <= t.inRangeTo && t.inRangeTo <= t.overAbove, {
    error: 'bandThresholds must satisfy inRangeFrom <= inRangeTo <= overAbove',
  })

// Screen share comes off only where the reading includes screen current: a sense
// resistor between cathode and ground, or the cathode resistor itself. A drop
// across the half primary, or an ammeter in the plate lead, is plate current.
const screenFraction = fraction('screenFraction').default(0.05)

const idleBase = {
  tubeId: z.string().min(1).optional(),
  mode: biasModeSchema,
  maxPlateWatts: positive('maxPlateWatts'),
  plateVolts: positive('plateVolts'),
  bandThresholds: idleBandThresholdsSchema.optional(),
}

export const idleDissipationInputSchema = z.discriminatedUnion('method', [
  z.object({
    ...idleBase,
    method: z.literal('sense-resistor'),
    senseVolts: positive('senseVolts'),
    senseOhms: positive('senseOhms'),
    screenFraction,
    /** Defaults to senseVolts: the sense resistor is the only thing between cathode and ground. */
    cathodeVolts: nonNegative('cathodeVolts').optional(),
  }),
  z.object({
    ...idleBase,
    method: z.literal('cathode-resistor'),
    cathodeVolts: positive('cathodeVolts'),
    cathodeOhms: positive('cathodeOhms'),
    tubesSharing: wholeAtLeast('tubesSharing', 1),
    screenFraction,
  }),
  z.object({
    ...idleBase,
    method: z.literal('primary-drop'),
    dropVolts: positive('dropVolts'),
    halfPrimaryOhms: positive('halfPrimaryOhms'),
    cathodeVolts: nonNegative('cathodeVolts').optional(),
  }),
  z.object({
    ...idleBase,
    method: z.literal('direct'),
    amps: positive('amps'),
    cathodeVolts: nonNegative('cathodeVolts').optional(),
  }),
], { error: "method must be 'sense-resistor', 'cathode-resistor', 'primary-drop' or 'direct'" })

const cathodeResistorBase = {
  cathodeVolts: positive('cathodeVolts'),
  tubesSharing: wholeAtLeast('tubesSharing', 1),
  bypassCornerHz: positive('bypassCornerHz').optional(),
}

export const cathodeResistorInputSchema = z.discriminatedUnion('target', [
  z.object({
    ...cathodeResistorBase,
    target: z.literal('current'),
    cathodeAmpsPerTube: positive('cathodeAmpsPerTube'),
  }),
  z.object({
    ...cathodeResistorBase,
    target: z.literal('percent'),
    percent: positive('percent'),
    plateVolts: positive('plateVolts'),
    maxPlateWatts: positive('maxPlateWatts'),
    screenFraction,
  }),
], { error: "target must be 'current' or 'percent'" })

export const biasSupplyInputSchema = z.object({
  tapVoltsRms: positive('tapVoltsRms'),
  diodeDropVolts: nonNegative('diodeDropVolts'),
  topOhms: nonNegative('topOhms'),
  potOhms: positive('potOhms'),
  bottomOhms: positive('bottomOhms'),
  targetGridVolts: negative('targetGridVolts').optional(),
})

const readingSchema = (name: string) =>
  z.object({
    kind: z.enum(['vpp', 'vrms'], { error: `${name}.kind must be 'vpp' or 'vrms'` }),
    volts: positive(`${name}.volts`),
  })

export const cleanPowerInputSchema = z.object({
  loadOhms: positive('loadOhms'),
  readingA: readingSchema('readingA'),
  readingB: readingSchema('readingB').optional(),
})

export const capDrainInputSchema = z.object({
  farads: positive('farads'),
  startVolts: positive('startVolts'),
  targetVolts: positive('targetVolts'),
  ohms: positive('ohms'),
  seconds: nonNegative('seconds').optional(),
})

export const loadReflectionInputSchema = z.object({
  primaryOhms: positive('primaryOhms'),
  secondaryOhms: positive('secondaryOhms'),
  speakerOhms: positive('speakerOhms'),
})

export const rcCornerInputSchema = z.discriminatedUnion('solveFor', [
  z.object({ solveFor: z.literal('hz'), ohms: positive('ohms'), farads: positive('farads') }),
  z.object({ solveFor: z.literal('farads'), ohms: positive('ohms'), hz: positive('hz') }),
], { error: "solveFor must be 'hz' or 'farads'" })

export const tubeSorterInputSchema = z.object({
  readings: z
    .array(z.object({
      id: z.string({ error: 'readings id must be a non-empty string' }).min(1, { error: 'readings id must be a non-empty string' }),
      amps: positive('readings amps'),
    }), { error: 'readings must be a list' })
    .max(500, { error: 'readings must hold at most 500 tubes' }),
  setSize: wholeAtLeast('setSize', 2),
  tolerance: nonNegative('tolerance'),
})

export const BENCH_TOOL_SCHEMAS = {
  'idle-dissipation': idleDissipationInputSchema,
  'cathode-resistor': cathodeResistorInputSchema,
  'bias-supply': biasSupplyInputSchema,
  'clean-power': cleanPowerInputSchema,
  'cap-drain': capDrainInputSchema,
  'load-reflection': loadReflectionInputSchema,
  'rc-corner': rcCornerInputSchema,
  'tube-sorter': tubeSorterInputSchema,
} as const satisfies Record<BenchToolId, z.ZodType>

export type BenchToolInputs = { [K in BenchToolId]: z.output<(typeof BENCH_TOOL_SCHEMAS)[K]> }
/** What a form may send: defaults (screenFraction) may be left out. */
export type BenchToolRawInputs = { [K in BenchToolId]: z.input<(typeof BENCH_TOOL_SCHEMAS)[K]> }
