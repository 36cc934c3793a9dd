import { describe, expect, it } from 'vitest'
import { formatMoney, MAX_MONEY_CENTS, parseMoneyCents, readMoney } from '../../shared/utils/jobs/money'

describe('parseMoneyCents: money as people type it', () => {
  it('reads both decimal marks', () => {
    // Source: the issue's own cases (a decimal comma must not read 100x too high).
    expect(parseMoneyCents('89,50')).toBe(8950)
    expect(parseMoneyCents('89.50')).toBe(8950)
    expect(parseMoneyCents('1,234.50')).toBe(123450)
    expect(parseMoneyCents('1.234,50')).toBe(123450)
    expect(parseMoneyCents('0,5')).toBe(50)
  })

  it('reads back what the platform formats in comma and point locales', () => {
    // Source: ECMA-402 Intl.NumberFormat with CLDR locale data (en-US, en-GB, de-DE, fr-FR, es-ES, nl-NL)
    // as an outside reference for how amounts are written in each convention.
    const locales = ['en-US', 'en-GB', 'de-DE', 'fr-FR', 'es-ES', 'nl-NL']
    const amounts = [5, 50, 995, 8950, 100000, 123450, 9999999, 12345678]
    for (const locale of locales) {
      const fmt = new Intl.NumberFormat(locale, { minimumFractionDigits: 2, maximumFractionDigits: 2, useGrouping: true })
      for (const cents of amounts) {
        const text = fmt.format(cents / 100)
        expect(parseMoneyCents(text), `${locale} ${text}`).toBe(cents)
      }
    }
  })

  it('reads a currency sign and grouping spaces', () => {
    // Source: ECMA-402 Intl.NumberFormat currency style (en-US puts the sign first).
    expect(parseMoneyCents(formatMoney(123450))).toBe(123450)
    expect(parseMoneyCents('$ 18')).toBe(1800)
    expect(parseMoneyCents('1 234,50')).toBe(123450)
  })

  it('refuses what is not an amount, with a sentence', () => {
    for (const bad of ['', '   ', 'abc', '12a', '-5', '−5', '5-', '1.2.3', '12,34,5', '0,505', '1,2345.00']) {
      const r = readMoney(bad)
      expect(r.ok, bad).toBe(false)
      if (!r.ok) expect(r.message.length).toBeGreaterThan(10)
    }
    expect(() => parseMoneyCents('-5')).toThrow(/negative/)
    expect(() => parseMoneyCents('')).toThrow(/enter an amount/)
    expect(() => parseMoneyCents('ten')).toThrow(RangeError)
  })

  it('refuses more than the record schemas take', () => {
    expect(parseMoneyCents('1000000')).toBe(MAX_MONEY_CENTS)
    expect(() => parseMoneyCents('1000000.01')).toThrow(/at most/)
  })
})
