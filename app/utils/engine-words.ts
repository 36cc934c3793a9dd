// The engine names its inputs in code ("cathodeVolts must be below plateVolts"); a person reads words.
const NAMED: Record<string, string> = {
  vTarget: 'target voltage', v0: 'starting voltage', vpp: 'peak-to-peak voltage', vrms: 'RMS voltage',
  hz: 'frequency', farads: 'capacitance', ohms: 'resistance', watts: 'power', volts: 'voltage', seconds: 'time',
  tapVoltsRms: 'tap voltage (RMS)', setSize: 'set size', tubesSharing: 'number of tubes sharing it',
  screenFraction: 'screen share', turnsRatio: 'turns ratio', maxWatts: 'maximum dissipation',
}
const UNIT_WORDS: Record<string, string> = { Volts: 'voltage', Amps: 'current', Ohms: 'resistance', Watts: 'power', Farads: 'capacitance', Hz: 'frequency', Seconds: 'time', Rms: '(RMS)' }

/** "plateToCathodeVolts" -> "plate-to-cathode voltage"; names it does not know are split into words. */
export function wordsForName(name: string): string {
  if (NAMED[name]) return NAMED[name]
  const parts = name.split(/(?=[A-Z])/)
  const words = parts.map((p, i) => (i > 0 && UNIT_WORDS[p] ? UNIT_WORDS[p] : p.toLowerCase()))
  const unitAt = words.findIndex((w, i) => i > 0 && Object.values(UNIT_WORDS).includes(w))
  const head = unitAt > 0 ? words.slice(0, unitAt) : words
  const tail = unitAt > 0 ? words.slice(unitAt) : []
  const joined = head.includes('to') ? head.join('-') : head.join(' ')
  return [joined, ...tail].join(' ')
}

/** Replaces every code-style name in an engine message with words and starts it with a capital. */
export function engineMessageInWords(message: string): string {
  // Plain words like "volts" are names only where a message starts with them ("volts must be ...").
  const out = message
    .replace(/^(?:v0|hz|farads|ohms|watts|volts|seconds|vpp|vrms)\b/, m => wordsForName(m))
    .replace(/\b(?:v0|[a-z]+[A-Z][A-Za-z0-9]*)\b/g, m => wordsForName(m))
  return out.charAt(0).toUpperCase() + out.slice(1)
}
