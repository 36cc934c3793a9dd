import { describe, expect, it } from 'vitest'
import { dateTimeText } from '../../app/utils/date-time'

describe('dateTimeText: absolute dates for printed records', () => {
  it('writes day, short month, year and 24-hour time in the device zone', () => {
    process.env.TZ = 'UTC'
    // Source: ECMA-402 Intl.DateTimeFormat en-GB parts (CLDR) for 2026-12-02T14:05Z in UTC; hand-read: 2 Dec 2026 14:05.
    expect(dateTimeText('2026-12-02T14:05:00.000Z')).toBe('2 Dec 2026 14:05')
    // Source: hand-read: midnight stays 00, not 24, and single-digit days carry no leading zero.
    expect(dateTimeText('2026-01-09T00:00:00.000Z')).toBe('9 Jan 2026 00:00')
  })

  it('is empty for nothing or nonsense, never "Invalid Date"', () => {
    expect(dateTimeText(null)).toBe('')
    expect(dateTimeText('not a date')).toBe('')
  })
})
