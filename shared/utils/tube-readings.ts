import { readQuantity } from './units'

export interface ParsedTubeReadings {
  readings: { id: string, amps: number }[]
  /** One message per line that could not be read, naming the line. */
  errors: string[]
}

// "A1 34.5", "A1: 34,5 mA", "34.5 mA", "V2 = 0.0345 A": an optional label, then the reading.
const LINE = /^(?:(.*?)[\s:=;]+)?([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)\s*[^\s\d]*)$/

/** One tube per line; a bare number is in mA; tubes without a label are numbered by line. */
export function parseTubeReadings(text: string): ParsedTubeReadings {
  const readings: ParsedTubeReadings['readings'] = []
  const errors: string[] = []
  const seen = new Set<string>()
  text.split(/\r?\n/).forEach((raw, index) => {
    const line = raw.trim()
    if (line === '') return
    const n = index + 1
    const m = LINE.exec(line)
    if (!m) {
      errors.push(`line ${n}: "${line}" has no reading at the end`)
      return
    }
    const q = readQuantity(m[2] ?? '', { defaultUnit: 'mA', dimension: 'A' })
    if (!q.ok) {
      errors.push(`line ${n}: ${q.error}`)
      return
    }
    if (q.value <= 0) {
      errors.push(`line ${n}: a reading must be above zero`)
      return
    }
    const id = m[1]?.trim() || `Tube ${n}`
    if (seen.has(id)) {
      errors.push(`line ${n}: the label "${id}" is used twice`)
      return
    }
    seen.add(id)
    readings.push({ id, amps: q.value })
  })
  return { readings, errors }
}
