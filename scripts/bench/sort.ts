// sortIntoSets on 1,000 readings, beside the sort of the same readings it starts with (copies
// ordered by current, ties by position): what is left is the checks and the grouping.
import { performance } from 'node:perf_hooks'
import { sortIntoSets, type TubeReading } from '../../shared/utils/bench/sort-into-sets'

function timePerCall(fn: () => unknown, minMs = 300) {
  for (let i = 0; i < 20; i++) fn()
  let calls = 0
  const t = performance.now()
  while (performance.now() - t < minMs) {
    fn()
    calls++
  }
  return (performance.now() - t) / calls
}

export function sortFigures(n = 1000) {
  // Readings spread like a box of one tube type: 30 to 40 mA, a fixed pseudo-random sequence.
  let seed = 12345
  const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31
  const readings: TubeReading[] = Array.from({ length: n }, (_, i) => ({ id: `t${i}`, amps: 0.030 + rand() * 0.010 }))
  const sets = sortIntoSets(readings, 4, 0.05).sets.length
  const ms = timePerCall(() => sortIntoSets(readings, 4, 0.05))
  const referenceMs = timePerCall(() => readings.map((r, index) => ({ ...r, index })).sort((a, b) => a.amps - b.amps || a.index - b.index))
  return { ms, referenceMs, sets }
}
