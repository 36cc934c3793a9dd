import { describe, expect, it } from 'vitest'
import { engineMessageInWords } from '../../app/utils/engine-words'
import { computeTool } from '../../shared/utils/bench/index'

const messageOf = (fn: () => unknown) => {
  try {
    fn()
  }
  catch (e) {
    return (e as Error).message
  }
  throw new Error('expected the engine to refuse')
}

describe('engine messages in words', () => {
  it('never shows a code-style input name', () => {
    expect(engineMessageInWords('cathodeVolts must be below plateVolts')).toBe('Cathode voltage must be below plate voltage')
    expect(engineMessageInWords('vTarget must be below v0')).toBe('Target voltage must be below starting voltage')
    expect(engineMessageInWords('plateToCathodeVolts must be a finite number')).toBe('Plate-to-cathode voltage must be a finite number')
    expect(engineMessageInWords('volts must be a positive number')).toBe('Voltage must be a positive number')
  })

  it('leaves plain words inside a sentence alone', () => {
    expect(engineMessageInWords('must be at most 600 volts')).toBe('Must be at most 600 volts')
  })

  it('turns a real engine refusal into words with no camel-case left', () => {
    const raw = messageOf(() => computeTool('cathode-resistor', { plateVolts: 250, cathodeVolts: 300, cathodeAmps: 0.05 } as never))
    const shown = engineMessageInWords(raw)
    expect(shown).not.toMatch(/\b[a-z]+[A-Z]/)
  })
})
