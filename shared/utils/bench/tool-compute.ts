import type { z } from 'zod'
import { cathodeResistorFor } from './cathode-resistor'
import { currentFromPrimaryDrop, currentFromSenseResistor, cathodeCurrentPerTube, plateCurrentFromCathode } from './current'
import { idleBand, idleCurrentForPercent, dissipationPercent, plateDissipation, resolveIdleBandThresholds } from './dissipation'
import type { IdleBand } from './dissipation'
import { biasSupplyRange } from './bias-supply'
import { nearestPreferred } from './e-series'
import { cleanPowerFromPeakToPeak, peakToPeakToRms, powerRatioDb, rmsPower } from './power'
import { capacitanceForCorner, capDrainSeconds, capEnergyJoules, capVoltageAfter, rcCornerHz } from './rc'
import { sortIntoSets } from './sort-into-sets'
import type { SortIntoSetsResult } from './sort-into-sets'
import { reflectedImpedance, turnsRatioForImpedances } from './transformer'
import { BENCH_TOOL_SCHEMAS, isBenchToolId } from './tool-schemas'
import type { BenchToolId, BenchToolInputs } from './tool-schemas'

export interface IdleDissipationOutputs {
  cathodeAmpsPerTube?: number
  plateAmps: number
  plateToCathodeVolts: number
  watts: number
  percent: number
  band: IdleBand
  /** Plate current that would land in the 'in range' band at this voltage. */
  inRangeAmps: { min: number, max: number }
}

export interface CathodeResistorOutputs {
  cathodeAmpsPerTube: number
  plateAmpsPerTube?: number
  ohms: number
  nearestE12: number
  nearestE24: number
  watts: number
  minRatingWatts: number
  bypassFarads?: number
}

export interface BiasSupplyOutputs {
  dcVolts: number
  leastNegativeVolts: number
  mostNegativeVolts: number
  targetInside?: boolean
  /** Distance to the nearer end of the range; negative when the target is outside it. */
  marginVolts?: number
}

export interface CleanPowerOutputs {
  vrmsA: number
  wattsA: number
  vrmsB?: number
  wattsB?: number
  /** B minus A. */
  differenceWatts?: number
  /** 10·log10(B / A). */
  differenceDb?: number
}

export interface CapDrainOutputs {
  timeConstantSeconds: number
  drainSeconds: number
  energyJoules: number
  voltsAfterSeconds?: number
}

export interface LoadReflectionOutputs {
  turnsRatio: number
  reflectedOhms: number
  /** Reflected over nominal primary. */
  mismatchRatio: number
  mismatch: boolean
}

export interface RcCornerOutputs {
  hz: number
  farads: number
}

export type TubeSorterOutputs = SortIntoSetsResult

export interface BenchToolOutputs {
  'idle-dissipation': IdleDissipationOutputs
  'cathode-resistor': CathodeResistorOutputs
  'bias-supply': BiasSupplyOutputs
  'clean-power': CleanPowerOutputs
  'cap-drain': CapDrainOutputs
  'load-reflection': LoadReflectionOutputs
  'rc-corner': RcCornerOutputs
  'tube-sorter': TubeSorterOutputs
}

// Common practice, no source: one tap off (a factor of 2) is tolerated by most
// output stages; beyond that the tool warns.
export const LOAD_MISMATCH_FACTOR = 2

function idleDissipation(i: BenchToolInputs['idle-dissipation']): IdleDissipationOutputs {
  let cathodeAmpsPerTube: number | undefined
  let plateAmps: number
  let cathodeVolts: number
  switch (i.method) {
    case 'sense-resistor':
      cathodeAmpsPerTube = currentFromSenseResistor(i.senseVolts, i.senseOhms)
      plateAmps = plateCurrentFromCathode(cathodeAmpsPerTube, i.screenFraction)
      cathodeVolts = i.cathodeVolts ?? i.senseVolts
      break
    case 'cathode-resistor':
      cathodeAmpsPerTube = cathodeCurrentPerTube(i.cathodeVolts, i.cathodeOhms, i.tubesSharing)
      plateAmps = plateCurrentFromCathode(cathodeAmpsPerTube, i.screenFraction)
      cathodeVolts = i.cathodeVolts
      break
    case 'primary-drop':
      plateAmps = currentFromPrimaryDrop(i.dropVolts, i.halfPrimaryOhms)
      cathodeVolts = i.cathodeVolts ?? 0
      break
    case 'direct':
      plateAmps = i.amps
      cathodeVolts = i.cathodeVolts ?? 0
      break
  }
  if (cathodeVolts >= i.plateVolts) throw new RangeError('cathodeVolts must be below plateVolts')
  const plateToCathodeVolts = i.plateVolts - cathodeVolts
  const watts = plateDissipation(plateToCathodeVolts, plateAmps)
  const percent = dissipationPercent(watts, i.maxPlateWatts)
  const t = resolveIdleBandThresholds(i.mode, i.bandThresholds)
  return {
    ...(cathodeAmpsPerTube === undefined ? {} : { cathodeAmpsPerTube }),
    plateAmps,
    plateToCathodeVolts,
    watts,
    percent,
    band: idleBand(percent, i.mode, i.bandThresholds),
    inRangeAmps: {
      min: idleCurrentForPercent(plateToCathodeVolts, i.maxPlateWatts, t.inRangeFrom),
      max: idleCurrentForPercent(plateToCathodeVolts, i.maxPlateWatts, t.inRangeTo),
    },
  }
}

function cathodeResistor(i: BenchToolInputs['cathode-resistor']): CathodeResistorOutputs {
  let cathodeAmpsPerTube: number
  let plateAmpsPerTube: number | undefined
  if (i.target === 'current') {
    cathodeAmpsPerTube = i.cathodeAmpsPerTube
  }
  else {
    if (i.cathodeVolts >= i.plateVolts) throw new RangeError('cathodeVolts must be below plateVolts')
    plateAmpsPerTube = idleCurrentForPercent(i.plateVolts - i.cathodeVolts, i.maxPlateWatts, i.percent)
    cathodeAmpsPerTube = plateAmpsPerTube / (1 - i.screenFraction)
  }
  const sizing = cathodeResistorFor(i.cathodeVolts, cathodeAmpsPerTube, i.tubesSharing)
  return {
    cathodeAmpsPerTube,
    ...(plateAmpsPerTube === undefined ? {} : { plateAmpsPerTube }),
    ohms: sizing.ohms,
    nearestE12: nearestPreferred(sizing.ohms, 'E12'),
    nearestE24: nearestPreferred(sizing.ohms, 'E24'),
    watts: sizing.watts,
    minRatingWatts: sizing.minRatingWatts,
    // Resistor alone; the cathode's own low impedance in parallel puts the real corner higher.
    ...(i.bypassCornerHz === undefined ? {} : { bypassFarads: capacitanceForCorner(sizing.ohms, i.bypassCornerHz) }),
  }
}

function biasSupply(i: BenchToolInputs['bias-supply']): BiasSupplyOutputs {
  const range = biasSupplyRange(i)
  if (i.targetGridVolts === undefined) return { ...range }
  const marginVolts = Math.min(
    i.targetGridVolts - range.mostNegativeVolts,
    range.leastNegativeVolts - i.targetGridVolts,
  )
  return { ...range, targetInside: marginVolts >= 0, marginVolts }
}

function vrmsOf(reading: { kind: 'vpp' | 'vrms', volts: number }): number {
  return reading.kind === 'vpp' ? peakToPeakToRms(reading.volts) : reading.volts
}

function cleanPower(i: BenchToolInputs['clean-power']): CleanPowerOutputs {
  const vrmsA = vrmsOf(i.readingA)
  const wattsA = i.readingA.kind === 'vpp'
    ? cleanPowerFromPeakToPeak(i.readingA.volts, i.loadOhms)
    : rmsPower(vrmsA, i.loadOhms)
  if (i.readingB === undefined) return { vrmsA, wattsA }
  const vrmsB = vrmsOf(i.readingB)
  const wattsB = i.readingB.kind === 'vpp'
    ? cleanPowerFromPeakToPeak(i.readingB.volts, i.loadOhms)
    : rmsPower(vrmsB, i.loadOhms)
  return {
    vrmsA,
    wattsA,
    vrmsB,
    wattsB,
    differenceWatts: wattsB - wattsA,
    differenceDb: powerRatioDb(wattsB, wattsA),
  }
}

function capDrain(i: BenchToolInputs['cap-drain']): CapDrainOutputs {
  if (i.targetVolts >= i.startVolts) throw new RangeError('targetVolts must be below startVolts')
  return {
    timeConstantSeconds: i.ohms * i.farads,
    drainSeconds: capDrainSeconds(i.startVolts, i.targetVolts, i.farads, i.ohms),
    energyJoules: capEnergyJoules(i.farads, i.startVolts),
    ...(i.seconds === undefined ? {} : { voltsAfterSeconds: capVoltageAfter(i.startVolts, i.seconds, i.farads, i.ohms) }),
  }
}

function loadReflection(i: BenchToolInputs['load-reflection']): LoadReflectionOutputs {
  const turnsRatio = turnsRatioForImpedances(i.primaryOhms, i.secondaryOhms)
  const reflectedOhms = reflectedImpedance(i.speakerOhms, turnsRatio)
  const mismatchRatio = reflectedOhms / i.primaryOhms
  return {
    turnsRatio,
    reflectedOhms,
    mismatchRatio,
    mismatch: mismatchRatio > LOAD_MISMATCH_FACTOR || mismatchRatio < 1 / LOAD_MISMATCH_FACTOR,
  }
}

function rcCorner(i: BenchToolInputs['rc-corner']): RcCornerOutputs {
  return i.solveFor === 'hz'
    ? { hz: rcCornerHz(i.ohms, i.farads), farads: i.farads }
    : { hz: i.hz, farads: capacitanceForCorner(i.ohms, i.hz) }
}

function tubeSorter(i: BenchToolInputs['tube-sorter']): TubeSorterOutputs {
  return sortIntoSets(i.readings, i.setSize, i.tolerance)
}

const COMPUTE: { [K in BenchToolId]: (inputs: BenchToolInputs[K]) => BenchToolOutputs[K] } = {
  'idle-dissipation': idleDissipation,
  'cathode-resistor': cathodeResistor,
  'bias-supply': biasSupply,
  'clean-power': cleanPower,
  'cap-drain': capDrain,
  'load-reflection': loadReflection,
  'rc-corner': rcCorner,
  'tube-sorter': tubeSorter,
}

function issueMessage(issue: z.core.$ZodIssue): string {
  const path = issue.path.map(String).join('.')
  const last = issue.path.length > 0 ? String(issue.path[issue.path.length - 1]) : ''
  return path === '' || issue.message.includes(last) ? issue.message : `${path}: ${issue.message}`
}

/** Validates and normalises (applies defaults); throws RangeError naming the first bad field. */
export function parseToolInputs<T extends BenchToolId>(toolId: T, inputs: unknown): BenchToolInputs[T] {
  if (!isBenchToolId(toolId)) throw new RangeError(`toolId must be one of the bench tools (got "${String(toolId)}")`)
  const result = BENCH_TOOL_SCHEMAS[toolId].safeParse(inputs)
  if (!result.success) {
    const first = result.error.issues[0]
    throw new RangeError(first ? issueMessage(first) : 'inputs are invalid', { cause: result.error })
  }
  return result.data as BenchToolInputs[T]
}

export function computeTool<T extends BenchToolId>(toolId: T, inputs: unknown): BenchToolOutputs[T] {
  const parsed = parseToolInputs(toolId, inputs)
  const compute = COMPUTE[toolId] as (i: BenchToolInputs[T]) => BenchToolOutputs[T]
  return compute(parsed)
}
