// When to retube: hours played on the fitted set and months since it went in, against the
// player's own thresholds. Pure, so the app shows it offline and the server's mail task agrees.

export type RetubeThreshold = 'hours' | 'months'

export interface RetubeThresholds { hours: number | null, months: number | null }

/** A starting point the screens offer; the player's own numbers always win. Common practice, no source. */
export const SUGGESTED_RETUBE: Readonly<{ hours: number, months: number }> = Object.freeze({ hours: 1000, months: 12 })

const DAY = /^(\d{4})-(\d{2})-(\d{2})$/

function parseDay(name: string, s: string): [number, number, number] {
  const m = DAY.exec(s)
  if (!m) throw new RangeError(`${name} must be a date like 2026-12-08`)
  const [y, mo, d] = [Number(m[1]), Number(m[2]), Number(m[3])]
  const check = new Date(Date.UTC(y, mo - 1, d))
  if (check.getUTCMonth() !== mo - 1 || check.getUTCDate() !== d) throw new RangeError(`${name} is not a calendar date`)
  return [y, mo, d]
}

const daysIn = (y: number, m: number) => new Date(Date.UTC(y, m, 0)).getUTCDate()

/**
 * Whole calendar months from `from` to `to` (YYYY-MM-DD): the most months that can be added to
 * `from` without passing `to`, a month added to the 31st landing on the month's last day.
 */
export function wholeMonthsBetween(from: string, to: string): number {
  const [y1, m1, d1] = parseDay('from', from)
  const [y2, m2, d2] = parseDay('to', to)
  let months = (y2 - y1) * 12 + (m2 - m1)
  // The day `from` lands on in `to`'s month (clamped to its last day).
  if (d2 < Math.min(d1, daysIn(y2, m2))) months--
  return Math.max(0, months)
}

/** Hours logged on gigs played on or after the day the set went in. */
export function hoursSince(fittedOn: string, gigs: readonly { playedOn: string, hours: number }[]): number {
  parseDay('fittedOn', fittedOn)
  let total = 0
  for (const g of gigs) {
    if (!(Number.isFinite(g.hours) && g.hours >= 0)) throw new RangeError('hours must be zero or more')
    if (g.playedOn >= fittedOn) total += g.hours
  }
  return total
}

export interface RetubeStatus {
  hoursPlayed: number
  monthsSince: number
  /** Thresholds reached, in the order hours, months. */
  due: RetubeThreshold[]
  /** Left before each threshold (null where the player set none). */
  hoursLeft: number | null
  monthsLeft: number | null
}

/** Where a fitted set stands against the player's thresholds on `today`. */
export function retubeStatus(o: { fittedOn: string, today: string, gigs: readonly { playedOn: string, hours: number }[], thresholds: RetubeThresholds }): RetubeStatus {
  const { hours, months } = o.thresholds
  for (const [name, v] of [['thresholds.hours', hours], ['thresholds.months', months]] as const) {
    if (v !== null && !(Number.isFinite(v) && v > 0)) throw new RangeError(`${name} must be more than 0`)
  }
  const hoursPlayed = hoursSince(o.fittedOn, o.gigs.filter(g => g.playedOn <= o.today))
  const monthsSince = wholeMonthsBetween(o.fittedOn, o.today)
  const due: RetubeThreshold[] = []
  if (hours !== null && hoursPlayed >= hours) due.push('hours')
  if (months !== null && monthsSince >= months) due.push('months')
  return {
    hoursPlayed, monthsSince, due,
    hoursLeft: hours === null ? null : Math.max(0, hours - hoursPlayed),
    monthsLeft: months === null ? null : Math.max(0, months - monthsSince),
  }
}

/** The set in the amp now: not a spare, not retired, the latest fitted. */
export function fittedSet<S extends { spare: boolean, retiredOn: string, fittedOn: string }>(sets: readonly S[]): S | undefined {
  return sets.filter(s => !s.spare && !s.retiredOn && s.fittedOn).sort((a, b) => b.fittedOn.localeCompare(a.fittedOn))[0]
}

/** A reminder's sentence, the same in the app and the e-mail. */
export function reminderText(t: RetubeThreshold, s: RetubeStatus, thresholds: RetubeThresholds): string {
  return t === 'hours'
    ? `${round1(s.hoursPlayed)} hours played on this set (your reminder: ${thresholds.hours} h). Time to have the tubes checked or replaced.`
    : `${s.monthsSince} months since this set went in (your reminder: ${thresholds.months} months). Time to have the tubes checked or replaced.`
}

const round1 = (x: number) => Math.round(x * 10) / 10
