import { requireNonNegative, requirePositive, requireWholeAtLeast } from './guards'

export interface TubeReading {
  id: string
  amps: number
}

export interface MatchedSet {
  ids: string[]
  meanAmps: number
  spreadFraction: number
}

export interface SortIntoSetsResult {
  sets: MatchedSet[]
  unmatched: string[]
}

// Readings are typed to a few digits; a set exactly at the tolerance edge must
// not fail on floating-point rounding of (1 + tolerance).
export const MATCH_EPSILON = 1e-9

export function withinTolerance(smallest: number, largest: number, tolerance: number): boolean {
  return largest / smallest - 1 <= tolerance + MATCH_EPSILON
}

interface Best {
  sets: number
  spread: number
  /** Start index of the set ending here, or -1 when reading i-1 is left unmatched. */
  takeFrom: number
}

function better(a: Best, b: Best): boolean {
  return a.sets > b.sets || (a.sets === b.sets && a.spread < b.spread)
}

function validate(readings: readonly TubeReading[], setSize: number, tolerance: number): void {
  if (!Array.isArray(readings)) throw new RangeError('readings must be a list')
  requireWholeAtLeast('setSize', setSize, 2)
  requireNonNegative('tolerance', tolerance)
  const seen = new Set<string>()
  readings.forEach((r, i) => {
    if (typeof r?.id !== 'string' || r.id.length === 0) {
      throw new RangeError(`readings[${i}].id must be a non-empty string`)
    }
    if (seen.has(r.id)) throw new RangeError(`readings[${i}].id must be unique ("${r.id}" repeats)`)
    seen.add(r.id)
    requirePositive(`readings[${i}].amps`, r.amps)
  })
}

/**
 * In sorted order an optimal grouping can always be uncrossed into contiguous
 * runs (swapping never widens a set), so a DP over prefixes finds the maximum
 * number of sets and, among those, the least total spread.
 */
export function sortIntoSets(
  readings: readonly TubeReading[],
  setSize: number,
  tolerance: number,
): SortIntoSetsResult {
  validate(readings, setSize, tolerance)
  const sorted = readings
    .map((r, index) => ({ ...r, index }))
    .sort((a, b) => a.amps - b.amps || a.index - b.index)

  const best: Best[] = [{ sets: 0, spread: 0, takeFrom: -1 }]
  for (let i = 1; i <= sorted.length; i++) {
    const skip = best[i - 1]!
    let choice: Best = { sets: skip.sets, spread: skip.spread, takeFrom: -1 }
    const from = i - setSize
    if (from >= 0) {
      const smallest = sorted[from]!.amps
      const largest = sorted[i - 1]!.amps
      if (withinTolerance(smallest, largest, tolerance)) {
        const before = best[from]!
        const take: Best = {
          sets: before.sets + 1,
          spread: before.spread + (largest / smallest - 1),
          takeFrom: from,
        }
        if (better(take, choice)) choice = take
      }
    }
    best.push(choice)
  }

  const sets: MatchedSet[] = []
  const matched = new Set<string>()
  for (let i = sorted.length; i > 0;) {
    const step = best[i]!
    if (step.takeFrom < 0) {
      i -= 1
      continue
    }
    const run = sorted.slice(step.takeFrom, i)
    const smallest = run[0]!.amps
    const largest = run[run.length - 1]!.amps
    sets.push({
      ids: run.map(r => r.id),
      meanAmps: run.reduce((sum, r) => sum + r.amps, 0) / run.length,
      spreadFraction: largest / smallest - 1,
    })
    run.forEach(r => matched.add(r.id))
    i = step.takeFrom
  }
  sets.reverse()
  return {
    sets,
    unmatched: readings.filter(r => !matched.has(r.id)).map(r => r.id),
  }
}
