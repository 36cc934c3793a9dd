import { describe, expect, it } from 'vitest'
import { formatNumber, formatQuantity, parseQuantity, readQuantity } from '../../shared/utils/units'

// Source for every prefix factor below: SI prefixes (BIPM SI Brochure, 9th ed., table 7):
// p = 1e-12, n = 1e-9, µ = 1e-6, m = 1e-3, k = 1e3, M = 1e6.
describe('parseQuantity', () => {
  it('reads the units a tech types into SI', () => {
    expect(parseQuantity('36 mA')).toBeCloseTo(0.036, 12)
    expect(parseQuantity('36mA')).toBeCloseTo(0.036, 12)
    expect(parseQuantity('350 mV')).toBeCloseTo(0.35, 12)
    expect(parseQuantity('285 V')).toBe(285)
    expect(parseQuantity('4.7 kΩ')).toBeCloseTo(4700, 9)
    expect(parseQuantity('1 MΩ')).toBeCloseTo(1e6, 6)
    expect(parseQuantity('100 µF')).toBeCloseTo(100e-6, 15)
    expect(parseQuantity('22 nF')).toBeCloseTo(22e-9, 18)
    expect(parseQuantity('470 pF')).toBeCloseTo(470e-12, 21)
    expect(parseQuantity('14 W')).toBe(14)
    expect(parseQuantity('48.97 Hz')).toBeCloseTo(48.97, 12)
    expect(parseQuantity('2 kHz')).toBe(2000)
    expect(parseQuantity('2.2 s')).toBeCloseTo(2.2, 12)
    expect(parseQuantity('250 ms')).toBeCloseTo(0.25, 12)
    expect(parseQuantity('5 %')).toBeCloseTo(0.05, 12)
  })

  it('accepts "u" and both micro signs, "k" alone, comma decimals and codes like 4k7', () => {
    expect(parseQuantity('100uF')).toBeCloseTo(100e-6, 15)
    expect(parseQuantity('100 \u00b5F')).toBeCloseTo(100e-6, 15) // micro sign
    expect(parseQuantity('100 \u03bcF')).toBeCloseTo(100e-6, 15) // Greek small mu
    expect(parseQuantity('100u')).toBeCloseTo(100e-6, 15)
    expect(parseQuantity('4.7k')).toBeCloseTo(4700, 9)
    expect(parseQuantity('4k7')).toBeCloseTo(4700, 9)
    expect(parseQuantity('2M2')).toBeCloseTo(2.2e6, 3)
    expect(parseQuantity('4R7')).toBeCloseTo(4.7, 12)
    expect(parseQuantity('4n7')).toBeCloseTo(4.7e-9, 18)
    expect(parseQuantity('34,5 mA')).toBeCloseTo(0.0345, 12)
    expect(parseQuantity('0,7')).toBeCloseTo(0.7, 12)
    expect(parseQuantity('470 ohms')).toBe(470)
    expect(parseQuantity('10 \u2126')).toBe(10) // the ohm sign, not the Greek capital omega
  })

  it('uses the default unit for a bare number', () => {
    expect(parseQuantity('36', 'mA')).toBeCloseTo(0.036, 12)
    expect(parseQuantity('130', 'Ω')).toBe(130)
    expect(parseQuantity('25', 'µF')).toBeCloseTo(25e-6, 15)
    expect(parseQuantity('36', undefined)).toBe(36)
    // A typed unit wins over the default.
    expect(parseQuantity('0.036 A', 'mA')).toBeCloseTo(0.036, 12)
  })

  it('reads a wrong-case unit only as the one bench unit it can mean', () => {
    expect(parseQuantity('36 MA')).toBeCloseTo(0.036, 12)
    expect(parseQuantity('36 ma')).toBeCloseTo(0.036, 12)
    expect(parseQuantity('350 MV')).toBeCloseTo(0.35, 12)
  })

  it('keeps negative numbers (grid voltages)', () => {
    expect(parseQuantity('-48 V')).toBe(-48)
    expect(parseQuantity('-52,5')).toBeCloseTo(-52.5, 12)
  })

  it('returns NaN for text that is not a quantity', () => {
    expect(parseQuantity('')).toBeNaN()
    expect(parseQuantity('abc')).toBeNaN()
    expect(parseQuantity('12 furlongs')).toBeNaN()
    expect(parseQuantity('1,2,3')).toBeNaN()
  })
})

describe('readQuantity', () => {
  it('refuses a unit of another kind and says which kind is needed', () => {
    const r = readQuantity('36 mV', { dimension: 'A', defaultUnit: 'mA' })
    expect(r.ok).toBe(false)
    if (!r.ok) expect(r.error).toBe('mV is a voltage; this needs a current')
  })

  it('tells an empty field from a bad one', () => {
    const empty = readQuantity('  ', { dimension: 'V' })
    expect(empty).toMatchObject({ ok: false, empty: true })
    const bad = readQuantity('12..3', { dimension: 'V' })
    expect(bad).toMatchObject({ ok: false, empty: false })
  })

  it('reports the unit it read, so a reading can carry Vpp or Vrms', () => {
    expect(readQuantity('29.93 Vpp', { dimension: 'V' })).toEqual({ ok: true, value: 29.93, unit: 'Vpp' })
    expect(readQuantity('10.58', { dimension: 'V', defaultUnit: 'Vrms' })).toEqual({ ok: true, value: 10.58, unit: 'Vrms' })
  })

  it('wants a plain number for a count', () => {
    expect(readQuantity('4', { dimension: 'count' })).toEqual({ ok: true, value: 4, unit: null })
    expect(readQuantity('4 mA', { dimension: 'count' }).ok).toBe(false)
  })
})

describe('formatQuantity', () => {
  it('picks the prefix that keeps three significant figures readable', () => {
    expect(formatQuantity(0.035, 'A')).toBe('35.0 mA')
    // Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V × 35 mA = 9.975 W, shown as 9.98 W
    expect(formatQuantity(285 * 0.035, 'W')).toBe('9.98 W')
    expect(formatQuantity(4700, 'Ω')).toBe('4.70 kΩ')
    expect(formatQuantity(130, 'Ω')).toBe('130 Ω')
    expect(formatQuantity(25e-6, 'F')).toBe('25.0 µF')
    expect(formatQuantity(22e-9, 'F')).toBe('22.0 nF')
    expect(formatQuantity(0.05, '%')).toBe('5.00 %')
    expect(formatQuantity(-70, 'V')).toBe('−70.0 V')
  })

  it('moves to the larger prefix when rounding reaches 1000', () => {
    expect(formatQuantity(0.9996, 'A')).toBe('1.00 A')
    expect(formatQuantity(10_000 * 100e-6, 's')).toBe('1.00 s')
    expect(formatQuantity(999.4, 'Ω')).toBe('999 Ω')
  })

  it('trims trailing zeros for preferred values and can hold one unit', () => {
    expect(formatQuantity(4700, 'Ω', { trim: true })).toBe('4.7 kΩ')
    expect(formatQuantity(0.0389, 'A', { unit: 'mA' })).toBe('38.9 mA')
    expect(formatNumber(71.25)).toBe('71.3')
    expect(formatNumber(Number.NaN)).toBe('–')
  })
})
