// Shop tube stock: how a set, a reading and a label read. Readings are SI (V, A, S).
import { formatNumber, formatQuantity, readQuantity } from './units'

export const setKind = (size: number) => (size === 2 ? 'pair' : size === 4 ? 'quad' : `set of ${size}`)

/** The job part a fitted set becomes: "Matched pair 6L6GC, set S-12". */
export const matchedSetPartDescription = (size: number, tubeName: string, label: string) =>
  `Matched ${setKind(size)} ${tubeName}, set ${label}`

/** Transconductance in siemens, as testers show it (mA/V). */
export const formatTransconductance = (s: number | null | undefined) =>
  (s === null || s === undefined || !Number.isFinite(s) ? '–' : `${formatNumber(s * 1000)} mA/V`)

export interface StockReading {
  label: string
  plateVolts: number
  gridVolts: number
  amps: number
  transconductance: number | null
  testedOn: string
  testedBy: string
}

/** "34.5 mA at 400 V plate, -45 V grid; 5.20 mA/V" */
export function readingText(t: StockReading): string {
  const gm = t.transconductance === null ? '' : `; ${formatTransconductance(t.transconductance)}`
  return `${formatQuantity(t.amps, 'A', { unit: 'mA' })} at ${formatQuantity(t.plateVolts, 'V', { unit: 'V' })} plate, ${formatQuantity(t.gridVolts, 'V', { unit: 'V' })} grid${gm}`
}

/** What a set's printed QR code carries: the set and each tube's reading, readable without the app. */
export function setLabelText(set: { label: string, size: number, spreadFraction: number }, tubeName: string, tubes: readonly StockReading[]): string {
  return [
    `Tubewright matched ${setKind(set.size)} ${tubeName}, set ${set.label}`,
    `spread ${formatQuantity(set.spreadFraction, '%', { digits: 2 })}`,
    ...tubes.map(t => `${t.label}: ${readingText(t)}; tested ${t.testedOn}${t.testedBy ? ` by ${t.testedBy}` : ''}`),
  ].join('\n')
}

/** The next free label with this prefix: "S-" and ["S-3", "S-12"] give "S-13". */
export function nextStockLabel(prefix: string, existing: readonly string[]): string {
  const n = existing.reduce((max, l) => {
    const m = l.startsWith(prefix) ? /^(\d+)/.exec(l.slice(prefix.length)) : null
    return m ? Math.max(max, Number(m[1])) : max
  }, 0)
  return `${prefix}${n + 1}`
}

/** A tube's stock label: the one typed in the sorter, or lot and place ("L3-07") when it had none. */
export const stockTubeLabel = (typed: string | null, lot: string, index: number) =>
  (typed && !/^Tube \d+$/.test(typed) ? typed.slice(0, 20) : `${lot}-${String(index + 1).padStart(2, '0')}`)

export interface ParsedStockReadings {
  readings: { label: string, amps: number, transconductance: number | null }[]
  errors: string[]
}

const NUMERIC = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)[^\d\s]*$/
const UNIT_ONLY = /^(?:[mµu]?A|mA\/V|mS)$/i

/**
 * A lot's readings, one tube per line: a label (optional), the current (a bare number is mA) and,
 * optionally, the transconductance in mA/V: "L3-07 34.5 5.2". Empty labels stay empty.
 */
export function parseStockReadings(text: string): ParsedStockReadings {
  const readings: ParsedStockReadings['readings'] = []
  const errors: string[] = []
  text.split(/\r?\n/).forEach((raw, index) => {
    const n = index + 1
    const tokens = raw.trim().split(/\s+/).filter(Boolean).reduce<string[]>((out, t) => {
      if (UNIT_ONLY.test(t) && out.length && NUMERIC.test(out[out.length - 1]!)) out[out.length - 1] += t
      else out.push(t)
      return out
    }, [])
    if (!tokens.length) return
    let first = tokens.length
    while (first > 0 && NUMERIC.test(tokens[first - 1]!)) first--
    const values = tokens.slice(first)
    const label = tokens.slice(0, first).join(' ').replace(/[:=;]$/, '')
    if (!values.length || values.length > 2) {
      errors.push(`line ${n}: give the current, then (optionally) the transconductance in mA/V`)
      return
    }
    const q = readQuantity(values[0]!, { defaultUnit: 'mA', dimension: 'A' })
    if (!q.ok || q.value <= 0) {
      errors.push(`line ${n}: ${q.ok ? 'the current must be above zero' : q.error}`)
      return
    }
    let gm: number | null = null
    if (values[1] !== undefined) {
      const v = Number(values[1].replace(/(mA\/V|mS)$/i, '').replace(',', '.'))
      if (!Number.isFinite(v) || v <= 0) {
        errors.push(`line ${n}: the transconductance must be a number of mA/V above zero`)
        return
      }
      gm = v / 1000
    }
    if (label.length > 20) {
      errors.push(`line ${n}: a label has at most 20 characters`)
      return
    }
    readings.push({ label, amps: q.value, transconductance: gm })
  })
  return { readings, errors }
}
