import { describe, expect, it } from 'vitest'
import { E_SERIES, nearestPreferred } from '../../../shared/utils/bench/index'

// Source: IEC 60063
const IEC_60063 = {
  E6: [1.0, 1.5, 2.2, 3.3, 4.7, 6.8],
  E12: [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2],
  E24: [
    1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0,
    3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
  ],
  E48: [
    1.00, 1.05, 1.10, 1.15, 1.21, 1.27, 1.33, 1.40, 1.47, 1.54, 1.62, 1.69,
    1.78, 1.87, 1.96, 2.05, 2.15, 2.26, 2.37, 2.49, 2.61, 2.74, 2.87, 3.01,
    3.16, 3.32, 3.48, 3.65, 3.83, 4.02, 4.22, 4.42, 4.64, 4.87, 5.11, 5.36,
    5.62, 5.90, 6.19, 6.49, 6.81, 7.15, 7.50, 7.87, 8.25, 8.66, 9.09, 9.53,
  ],
  E96: [
    1.00, 1.02, 1.05, 1.07, 1.10, 1.13, 1.15, 1.18, 1.21, 1.24, 1.27, 1.30,
    1.33, 1.37, 1.40, 1.43, 1.47, 1.50, 1.54, 1.58, 1.62, 1.65, 1.69, 1.74,
    1.78, 1.82, 1.87, 1.91, 1.96, 2.00, 2.05, 2.10, 2.15, 2.21, 2.26, 2.32,
    2.37, 2.43, 2.49, 2.55, 2.61, 2.67, 2.74, 2.80, 2.87, 2.94, 3.01, 3.09,
    3.16, 3.24, 3.32, 3.40, 3.48, 3.57, 3.65, 3.74, 3.83, 3.92, 4.02, 4.12,
    4.22, 4.32, 4.42, 4.53, 4.64, 4.75, 4.87, 4.99, 5.11, 5.23, 5.36, 5.49,
    5.62, 5.76, 5.90, 6.04, 6.19, 6.34, 6.49, 6.65, 6.81, 6.98, 7.15, 7.32,
    7.50, 7.68, 7.87, 8.06, 8.25, 8.45, 8.66, 8.87, 9.09, 9.31, 9.53, 9.76,
  ],
} as const

type Name = keyof typeof IEC_60063
const NAMES = Object.keys(IEC_60063) as Name[]
const digitsOf = (name: Name) => (name === 'E48' || name === 'E96' ? 3 : 2)

describe('E-series lists', () => {
  it.each(NAMES)('%s matches IEC 60063 value by value', (name) => {
    // Source: IEC 60063
    const scale = 10 ** (digitsOf(name) - 1)
    const expected = IEC_60063[name].map(v => Math.round(v * scale))
    expect(E_SERIES[name]).toHaveLength(Number(name.slice(1)))
    expect([...E_SERIES[name]]).toEqual(expected)
  })

  it('E24 holds the standard values that sit off the geometric series', () => {
    // Source: IEC 60063 (E24 values 2.7 ... 4.7 and 8.2 differ from round(10^(i/24)))
    const computed = Array.from({ length: 24 }, (_, i) => Math.round(10 ** (i / 24) * 10))
    const differing = E_SERIES.E24.filter((v, i) => v !== computed[i])
    expect(differing).toEqual([27, 30, 33, 36, 39, 43, 47, 82])
  })

  it('E48 and E96 follow the geometric series rounded to three figures, E48 being every other E96 value', () => {
    // Source: IEC 60063 (E48/E96 defined as 10^(i/N), three significant figures)
    for (const n of [48, 96] as const) {
      const computed = Array.from({ length: n }, (_, i) => Math.round(10 ** (i / n) * 100))
      expect([...E_SERIES[`E${n}`]]).toEqual(computed)
    }
    expect(E_SERIES.E96.filter((_, i) => i % 2 === 0)).toEqual([...E_SERIES.E48])
  })

  it('each coarser series of E6-E24 is every other value of the next finer one', () => {
    // Source: IEC 60063
    expect(E_SERIES.E12.filter((_, i) => i % 2 === 0)).toEqual([...E_SERIES.E6])
    expect(E_SERIES.E24.filter((_, i) => i % 2 === 0)).toEqual([...E_SERIES.E12])
  })
})

describe('nearestPreferred', () => {
  it('finds the nearest value in any decade', () => {
    // Source: IEC 60063 (lists above)
    expect(nearestPreferred(130, 'E24')).toBe(130)
    expect(nearestPreferred(130, 'E12')).toBe(120)
    expect(nearestPreferred(164, 'E12')).toBe(150) // log midpoint √(150·180) ≈ 164.3
    expect(nearestPreferred(165, 'E12')).toBe(180)
    expect(nearestPreferred(4.6, 'E6')).toBe(4.7)
    expect(nearestPreferred(0.00047, 'E12')).toBe(0.00047)
    expect(nearestPreferred(2.2e-5, 'E6')).toBe(2.2e-5)
    expect(nearestPreferred(2_150_000, 'E48')).toBe(2_150_000)
    expect(nearestPreferred(976, 'E96')).toBe(976)
    expect(nearestPreferred(990, 'E96')).toBe(1000)
    expect(nearestPreferred(9.9, 'E24')).toBe(10)
  })

  it('the 12AX7\'s 1667 Ω cathode resistor: 1.8 kΩ in E12, 1.6 kΩ in E24', () => {
    // Source: SOURCES.md 12AX7 (−2 V at 1.2 mA → 1666.7 Ω, S1) and IEC 60063 lists. By hand, log10 distances:
    // E12 1500: log10(1666.7 / 1500) = 0.0458; 1800: log10(1800 / 1666.7) = 0.0334 → 1800.
    // E24 1600: log10(1666.7 / 1600) = 0.0177; 1800: 0.0334 → 1600
    expect(nearestPreferred(2 / 0.0012, 'E12')).toBe(1800)
    expect(nearestPreferred(2 / 0.0012, 'E24')).toBe(1600)
  })

  it('compares on a log scale, not a linear one', () => {
    // 82 and 100 straddle 90.5: linear midpoint is 91, log midpoint is √8200 ≈ 90.55.
    // Source: IEC 60063 (lists above)
    expect(nearestPreferred(90.8, 'E12')).toBe(100)
    expect(nearestPreferred(90.3, 'E12')).toBe(82)
  })

  it('a tie on the log scale goes to the higher value', () => {
    // Source: IEC 60063 (lists above); tie rule as the engine defines it
    expect(nearestPreferred(Math.sqrt(10 * 12), 'E12')).toBe(12)
    expect(nearestPreferred(Math.sqrt(10 * 12) * (1 - 1e-6), 'E12')).toBe(10)
    expect(nearestPreferred(Math.sqrt(68 * 100) * 1000, 'E6')).toBe(100_000)
  })

  it('rejects non-positive values and unknown series', () => {
    expect(() => nearestPreferred(0, 'E12')).toThrow(new RangeError('value must be a positive number'))
    expect(() => nearestPreferred(-10, 'E12')).toThrow(/value/)
    expect(() => nearestPreferred(Number.NaN, 'E12')).toThrow(/value/)
    expect(() => nearestPreferred(10, 'E3' as 'E6')).toThrow(/series/)
  })
})
