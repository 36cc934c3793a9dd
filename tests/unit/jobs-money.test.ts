import { describe, expect, it } from 'vitest'
import { invoiceTotals, labourTotalCents, partTotalCents, roundCents } from '../../shared/utils/jobs/money'

describe('invoice money in integer cents', () => {
  it('adds parts and labour and taxes the subtotal at 8.25 %', () => {
    // Source: arithmetic, worked by hand: 2 x 6400 = 12 800; 90 min at 9000 /h = 1.5 x 9000 = 13 500;
    // subtotal 26 300; 26 300 x 0.0825 = 2 169.75 -> 2 170; total 28 470.
    const t = invoiceTotals([{ quantity: 2, unitPriceCents: 6400 }], [{ minutes: 90, rateCents: 9000 }], 825)
    expect(t).toEqual({ partsCents: 12_800, labourCents: 13_500, subtotalCents: 26_300, taxCents: 2_170, totalCents: 28_470 })
  })

  it('rounds half away from zero', () => {
    // Source: round half away from zero, as commonly used for currency (common practice, no source)
    expect(roundCents(2169.5)).toBe(2170)
    expect(roundCents(2169.49)).toBe(2169)
    expect(roundCents(-2169.5)).toBe(-2170)
    // Source: arithmetic, worked by hand: 1 000 x 0.0825 = 82.5 -> 83 (half goes up, not to even).
    expect(invoiceTotals([{ quantity: 1, unitPriceCents: 1000 }], [], 825).taxCents).toBe(83)
  })

  it('bills labour pro rata by the minute and parts by quantity', () => {
    // Source: arithmetic, worked by hand: 20 min at 9000 /h = 9000 / 3 = 3 000; 45 min = 6 750.
    expect(labourTotalCents({ minutes: 20, rateCents: 9000 })).toBe(3000)
    expect(labourTotalCents({ minutes: 45, rateCents: 9000 })).toBe(6750)
    // Source: arithmetic, worked by hand: 7 min at 8500 /h = 991.67 -> 992.
    expect(labourTotalCents({ minutes: 7, rateCents: 8500 })).toBe(992)
    // Source: arithmetic, worked by hand: 2.5 x 333 = 832.5 -> 833.
    expect(partTotalCents({ quantity: 2.5, unitPriceCents: 333 })).toBe(833)
  })

  it('takes no tax at 0 bp and refuses a fractional or negative rate', () => {
    // Source: arithmetic, worked by hand: 4 x 700 + 150 min at 9000 /h (22 500) = 25 300, no tax.
    expect(invoiceTotals([{ quantity: 4, unitPriceCents: 700 }], [{ minutes: 150, rateCents: 9000 }], 0)).toMatchObject({ subtotalCents: 25_300, taxCents: 0, totalCents: 25_300 })
    expect(() => invoiceTotals([], [], 8.25)).toThrow(RangeError)
    expect(() => invoiceTotals([], [], -1)).toThrow(RangeError)
  })
})
