import { requirePositive } from './guards'

export type ESeries = 'E6' | 'E12' | 'E24' | 'E48' | 'E96'

// IEC 60063 preferred numbers, one decade, as integers of the series' own
// significant digits. Literal lists: E6-E24 (and so the values derived from
// them) include standard values that sit off the geometric series.
export const E_SERIES: Readonly<Record<ESeries, readonly number[]>> = Object.freeze({
  E6: Object.freeze([10, 15, 22, 33, 47, 68]),
  E12: Object.freeze([10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82]),
  E24: Object.freeze([
    10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30,
    33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91,
  ]),
  E48: Object.freeze([
    100, 105, 110, 115, 121, 127, 133, 140, 147, 154, 162, 169,
    178, 187, 196, 205, 215, 226, 237, 249, 261, 274, 287, 301,
    316, 332, 348, 365, 383, 402, 422, 442, 464, 487, 511, 536,
    562, 590, 619, 649, 681, 715, 750, 787, 825, 866, 909, 953,
  ]),
  E96: Object.freeze([
    100, 102, 105, 107, 110, 113, 115, 118, 121, 124, 127, 130,
    133, 137, 140, 143, 147, 150, 154, 158, 162, 165, 169, 174,
    178, 182, 187, 191, 196, 200, 205, 210, 215, 221, 226, 232,
    237, 243, 249, 255, 261, 267, 274, 280, 287, 294, 301, 309,
    316, 324, 332, 340, 348, 357, 365, 374, 383, 392, 402, 412,
    422, 432, 442, 453, 464, 475, 487, 499, 511, 523, 536, 549,
    562, 576, 590, 604, 619, 634, 649, 665, 681, 698, 715, 732,
    750, 768, 787, 806, 825, 845, 866, 887, 909, 931, 953, 976,
  ]),
})

export const E_SERIES_NAMES: readonly ESeries[] = Object.freeze(['E6', 'E12', 'E24', 'E48', 'E96'])

// Log-distance ties are decided within this margin, since exact ties rarely survive floating point.
const TIE_EPSILON = 1e-12

function scaled(mantissa: number, exponent: number): number {
  // Dividing by an exact power of ten keeps 4.7 as the double nearest 4.7.
  return exponent >= 0 ? mantissa * 10 ** exponent : mantissa / 10 ** -exponent
}

export function nearestPreferred(value: number, series: ESeries): number {
  requirePositive('value', value)
  const mantissas = E_SERIES[series]
  if (mantissas === undefined) {
    throw new RangeError(`series must be one of ${E_SERIES_NAMES.join(', ')}`)
  }
  const digits = series === 'E48' || series === 'E96' ? 3 : 2
  const decade = Math.floor(Math.log10(value))
  const target = Math.log10(value)
  let best = Number.NaN
  let bestDistance = Number.POSITIVE_INFINITY
  for (let d = decade - 1; d <= decade + 1; d++) {
    for (const m of [...mantissas, 10 ** digits]) {
      const candidate = scaled(m, d - (digits - 1))
      const distance = Math.abs(Math.log10(candidate) - target)
      if (distance < bestDistance - TIE_EPSILON
        || (Math.abs(distance - bestDistance) <= TIE_EPSILON && candidate > best)) {
        best = candidate
        bestDistance = distance
      }
    }
  }
  return best
}
