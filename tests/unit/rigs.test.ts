import { describe, expect, it } from 'vitest'
import { fittedSet, hoursSince, latestReadings, readingBand, readingSeries, retubeStatus, SUGGESTED_RETUBE, wholeMonthsBetween } from '../../shared/utils/rigs/index'

describe('whole calendar months between two days', () => {
  // Source: python-dateutil 2.9, relativedelta(to, from) -> years*12 + months, run for each pair
  // below; it adds months the same way (a month after the 31st is the next month's last day).
  it.each([
    ['2026-01-31', '2026-02-28', 1],
    ['2026-01-31', '2026-03-01', 1],
    ['2026-01-30', '2026-02-28', 1],
    ['2026-02-28', '2026-03-27', 0],
    ['2026-05-31', '2026-06-30', 1],
    ['2026-05-31', '2026-06-29', 0],
    ['2025-06-15', '2026-06-14', 11],
    ['2025-06-15', '2026-06-15', 12],
    ['2024-02-29', '2025-02-28', 12],
    ['2026-03-10', '2026-09-10', 6],
  ])('%s to %s is %i', (from, to, months) => {
    expect(wholeMonthsBetween(from, to)).toBe(months)
  })

  it('is never negative, and refuses a day that is not a date', () => {
    expect(wholeMonthsBetween('2026-06-01', '2026-01-01')).toBe(0)
    expect(() => wholeMonthsBetween('2026-02-30', '2026-03-01')).toThrow(/from is not a calendar date/)
    expect(() => wholeMonthsBetween('2026-02-01', 'soon')).toThrow(RangeError)
  })
})

describe('retube status', () => {
  const gigs = [
    { playedOn: '2026-01-09', hours: 3 }, // before the set went in: not counted
    { playedOn: '2026-01-10', hours: 2.5 },
    { playedOn: '2026-02-14', hours: 4 },
    { playedOn: '2026-03-01', hours: 3.5 },
  ]

  it('counts only the hours played on the fitted set', () => {
    // Source: hand sum of the gigs on or after 2026-01-10: 2.5 + 4 + 3.5 = 10.
    expect(hoursSince('2026-01-10', gigs)).toBe(10)
    expect(() => hoursSince('2026-01-10', [{ playedOn: '2026-02-01', hours: -1 }])).toThrow(/hours/)
  })

  it('is due exactly when a threshold is reached, each on its own', () => {
    const at = (today: string, hours: number | null, months: number | null) =>
      retubeStatus({ fittedOn: '2026-01-10', today, gigs, thresholds: { hours, months } })
    // 6.5 h by 2026-02-14 (2.5 + 4), 10 h by 2026-03-01.
    expect(at('2026-02-14', 10, null).due).toEqual([])
    expect(at('2026-02-14', 10, null).hoursLeft).toBe(3.5)
    expect(at('2026-03-01', 10, null).due).toEqual(['hours'])
    // Source: python-dateutil relativedelta('2026-07-09', '2026-01-10') = 5 months 29 days; to 2026-07-10 = 6 months.
    expect(at('2026-07-09', null, 6).due).toEqual([])
    expect(at('2026-07-09', null, 6).monthsLeft).toBe(1)
    expect(at('2026-07-10', null, 6).due).toEqual(['months'])
    expect(at('2026-07-10', 10, 6).due).toEqual(['hours', 'months'])
    // A gig logged for a later day does not count yet.
    expect(at('2026-02-20', 10, null).hoursPlayed).toBe(6.5)
  })

  it('needs thresholds above zero, and none set means never due', () => {
    expect(() => retubeStatus({ fittedOn: '2026-01-10', today: '2026-03-01', gigs, thresholds: { hours: 0, months: null } })).toThrow(/thresholds.hours/)
    expect(retubeStatus({ fittedOn: '2020-01-10', today: '2026-03-01', gigs, thresholds: { hours: null, months: null } }).due).toEqual([])
  })

  it('offers a starting point that the player then sets', () => {
    // common practice, no source: a year, or about a thousand hours, between checks of power tubes.
    expect(SUGGESTED_RETUBE).toEqual({ hours: 1000, months: 12 })
  })

  it('takes the latest set that is neither spare nor retired as the fitted one', () => {
    const sets = [
      { id: 'a', spare: false, retiredOn: '2025-12-01', fittedOn: '2025-01-01' },
      { id: 'b', spare: false, retiredOn: '', fittedOn: '2025-12-01' },
      { id: 'c', spare: true, retiredOn: '', fittedOn: '2026-02-01' },
    ]
    expect(fittedSet(sets)?.id).toBe('b')
    expect(fittedSet(sets.filter(s => s.id !== 'b'))).toBeUndefined()
  })
})

describe('readings', () => {
  it('puts a reading in its idle band against the tube type\'s plate rating', () => {
    // Source: P = V x I; 6L6GC maximum plate dissipation 30 W (General Electric, Essential
    // Characteristics, 1973, as listed in SOURCES.md). 450 V x 40 mA = 18 W = 60 % of 30 W.
    const r = readingBand({ mA: 40, plateVolts: 450 }, '6L6GC', 'fixed')
    expect(r?.percent).toBeCloseTo(60, 9)
    // common practice, no source: fixed bias 50-70 % of rating is "in range", 70-100 % "warm".
    expect(r?.band).toBe('in range')
    // 450 V x 60 mA = 27 W = 90 %.
    expect(readingBand({ mA: 60, plateVolts: 450 }, '6l6gc', 'fixed')?.band).toBe('warm')
    expect(readingBand({ mA: 40, plateVolts: null }, '6L6GC', 'fixed')).toBeNull()
    expect(readingBand({ mA: 40, plateVolts: 450 }, 'unknown-type', 'fixed')).toBeNull()
  })

  const readings = [
    { on: '2026-01-10', position: 'V6', mA: 38, plateVolts: 440 },
    { on: '2026-01-10', position: 'V5', mA: 36, plateVolts: 440 },
    { on: '2026-04-02', position: 'V5', mA: 34, plateVolts: null },
    { on: '2026-04-02', position: 'V10', mA: 35, plateVolts: null },
  ]

  it('keeps the newest reading per position, in socket order', () => {
    expect(latestReadings(readings).map(r => [r.position, r.mA])).toEqual([['V5', 34], ['V6', 38], ['V10', 35]])
  })

  it('draws one series per position, oldest first', () => {
    const s = readingSeries([...readings].reverse())
    expect(s.map(x => x.position)).toEqual(['V5', 'V6', 'V10'])
    expect(s[0]!.points).toEqual([{ on: '2026-01-10', mA: 36 }, { on: '2026-04-02', mA: 34 }])
  })
})
