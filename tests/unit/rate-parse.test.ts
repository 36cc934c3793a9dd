import { describe, expect, it } from 'vitest'
import { formatRate, parseRateBasisPoints, SHOP_CURRENCIES } from '../../shared/utils/jobs/money'

describe('tax rates as typed', () => {
  it('reads percent in either decimal mark as basis points', () => {
    // Source: a basis point is one hundredth of a percent (0.01 %), the usual definition in finance
    // (e.g. the Oxford English Dictionary, "basis point"); 8.25 % = 825 bp.
    expect(parseRateBasisPoints('8.25')).toBe(825)
    expect(parseRateBasisPoints('8,25')).toBe(825)
    expect(parseRateBasisPoints('8,25 %')).toBe(825)
    expect(parseRateBasisPoints('0')).toBe(0)
    expect(parseRateBasisPoints('20')).toBe(2000)
    expect(parseRateBasisPoints('100')).toBe(10_000)
  })

  it('refuses what is not a rate, with a sentence', () => {
    expect(() => parseRateBasisPoints('100,01')).toThrow('at most 100 %')
    expect(() => parseRateBasisPoints('-5')).toThrow('cannot be negative')
    expect(() => parseRateBasisPoints('eight')).toThrow(RangeError)
    expect(() => parseRateBasisPoints('')).toThrow(RangeError)
    expect(() => parseRateBasisPoints('8.125')).toThrow('at most two decimals')
  })

  it('shows basis points back as percent', () => {
    // Source: the same definition, read the other way: 825 bp = 8.25 %.
    expect(formatRate(825)).toBe('8.25 %')
    expect(formatRate(2000)).toBe('20 %')
  })

  it('offers only currencies with two-digit minor units', () => {
    // Source: ISO 4217 list one (SIX Financial Information, maintenance agency): the minor unit of
    // USD, EUR, GBP, CAD, AUD, NZD, CHF, SEK, NOK and DKK is 2. Checked against ECMA-402 as well.
    for (const code of SHOP_CURRENCIES) {
      expect(new Intl.NumberFormat('en', { style: 'currency', currency: code }).resolvedOptions().maximumFractionDigits, code).toBe(2)
    }
  })
})
