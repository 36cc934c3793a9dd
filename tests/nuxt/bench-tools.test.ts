import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { BenchBiasSupply, BenchCapDrain, BenchCleanPower, BenchLoadReflection, BenchRcCorner, BenchTubeSorter } from '#components'
import { choose, fieldError, testid, type } from './helpers'

beforeEach(() => {
  localStorage.clear()
})

describe('Clean power', () => {
  it('reads Vpp and Vrms into watts side by side, with the difference in dB', async () => {
    const w = await mountSuspended(BenchCleanPower)
    await type(w, '#power-load', '8')
    // Source: Ohm's law and sine RMS: 14 W into 8 Ω is 10.58 Vrms, 29.93 Vpp; 50 W is 20.0 Vrms
    await type(w, '#power-a', '29.93 Vpp')
    await type(w, '#power-b', '20 Vrms')
    expect(testid(w, 'watts-a').text()).toBe('14.0 W')
    expect(testid(w, 'watts-b').text()).toBe('50.0 W')
    expect(w.text()).toContain('10.6 V RMS')
    // 10·log10(50 / 14) = 5.53 dB
    expect(testid(w, 'difference').text()).toContain('+36.0 W')
    expect(testid(w, 'difference').text()).toContain('+5.5 dB')
  })

  it('warns to load the output stage before the inputs', async () => {
    const w = await mountSuspended(BenchCleanPower)
    const html = w.html()
    expect(html.indexOf('Never run the output stage without a load')).toBeGreaterThan(-1)
    expect(html.indexOf('Never run the output stage without a load')).toBeLessThan(html.indexOf('id="power-load"'))
  })
})

describe('Cap drain', () => {
  it('100 µF through 10 kΩ from 450 V to 50 V: 2.20 s, 10.1 J, and always says to verify', async () => {
    // Source: RC discharge law t = RC·ln(V0/V) and E = ½CV²
    const w = await mountSuspended(BenchCapDrain)
    await type(w, '#drain-cap', '100')
    await type(w, '#drain-start', '450')
    await type(w, '#drain-target', '50')
    await type(w, '#drain-ohms', '10k')
    expect(testid(w, 'drain-seconds').text()).toBe('2.20 s')
    expect(testid(w, 'energy').text()).toBe('10.1 J')
    expect(testid(w, 'verify').text()).toContain('Verify every capacitor with a meter')
    expect(w.text()).toContain('Never trust a bleeder')
    expect(w.text()).toContain('Residual voltage can return')
  })

  it('puts "target below start" beside the target field', async () => {
    const w = await mountSuspended(BenchCapDrain)
    await type(w, '#drain-cap', '100')
    await type(w, '#drain-start', '450')
    await type(w, '#drain-target', '500')
    await type(w, '#drain-ohms', '10k')
    expect(fieldError(w, 'drain-target').text()).toBe('Target voltage must be below starting voltage')
  })
})

describe('Load reflection', () => {
  it('8 kΩ to 8 Ω is 31.62 : 1; a 16 Ω speaker on that tap reflects 16 kΩ', async () => {
    // Source: reflected impedance law Zp = Zs·n²
    const w = await mountSuspended(BenchLoadReflection)
    await type(w, '#load-primary', '8')
    await type(w, '#load-secondary', '8')
    await type(w, '#load-speaker', '16')
    expect(testid(w, 'turns').text()).toBe('31.62 : 1')
    expect(testid(w, 'reflected').text()).toBe('16.0 kΩ')
    // common practice, no source: more than a factor of two off is a mismatch; exactly two is tolerated
    expect(testid(w, 'matched').exists()).toBe(true)
    await type(w, '#load-speaker', '17')
    expect(w.find('aside[aria-label="Mismatch"]').exists()).toBe(true)
    expect(testid(w, 'matched').exists()).toBe(false)
    await type(w, '#load-speaker', '3.9')
    expect(w.find('aside[aria-label="Mismatch"]').exists()).toBe(true)
  })
})

describe('RC corner', () => {
  it('solves either way: 130 Ω with 25 µF is 48.97 Hz, and back', async () => {
    // Source: RC high-pass corner f = 1/(2πRC)
    const w = await mountSuspended(BenchRcCorner)
    await choose(w, 'Corner from R and C')
    await w.find('select[aria-label="Resistance: unit"]').setValue('Ω')
    await type(w, '#rc-ohms', '130')
    await type(w, '#rc-cap', '25 µF')
    expect(testid(w, 'hz').text()).toBe('49.0 Hz')
    await choose(w, 'C for a corner')
    await type(w, '#rc-hz', '48.97')
    expect(testid(w, 'farads').text()).toBe('25.0 µF')
  })
})

describe('Bias supply', () => {
  it('a 50 Vrms tap through a 0.7 V diode gives −70.0 V unloaded', async () => {
    // Source: half-wave peak, −(50·√2 − 0.7) = −70.0 V
    const w = await mountSuspended(BenchBiasSupply)
    await type(w, '#bias-tap', '50')
    await type(w, '#bias-diode', '0.7')
    await type(w, '#bias-top', '10')
    await type(w, '#bias-pot', '25')
    await type(w, '#bias-bottom', '15')
    expect(testid(w, 'dc-volts').text()).toBe('−70.0 V')
    // Divider: −70.0 × 15/50 = −21.0 V and −70.0 × 40/50 = −56.0 V (BENCH-MATH definition)
    expect(testid(w, 'least').text()).toBe('−21.0 V')
    expect(testid(w, 'most').text()).toBe('−56.0 V')
    // −48 V sits 8.01 V inside the most negative end (−56.01 V before rounding)
    await type(w, '#bias-target', '-48')
    expect(testid(w, 'target-verdict').text()).toContain('Inside the range, 8.01 V from the nearer end')
    await type(w, '#bias-target', '-60')
    expect(testid(w, 'target-verdict').text()).toContain('Outside the range by 3.99 V')
    await type(w, '#bias-target', '48')
    expect(fieldError(w, 'bias-target').text()).toBe('Target grid voltage must be a negative number')
  })
})

describe('Tube sorter', () => {
  it('pairs readings within 5 %, lists the odd one out, and prints a label per tube', async () => {
    // common practice, no source: matched when highest ≤ (1 + tolerance) × lowest
    const w = await mountSuspended(BenchTubeSorter)
    await type(w, '#sorter-readings', 'A1 30\nA2 30.5\nA3 40 mA\nA4 33')
    await choose(w, 'Pairs')
    await type(w, '#sorter-tolerance', '5')
    const sets = testid(w, 'sets').findAll('li')
    expect(sets).toHaveLength(1)
    expect(sets[0]!.text()).toContain('A1 30.0 mA')
    expect(sets[0]!.text()).toContain('A2 30.5 mA')
    expect(testid(w, 'unmatched').text()).toContain('A3 40.0 mA')
    expect(testid(w, 'unmatched').text()).toContain('A4 33.0 mA')
    expect(w.findAll('.tube-label')).toHaveLength(4)
    expect(w.find('.tube-labels').text()).toContain('Set 1 · pair')
  })

  it('names the line that could not be read', async () => {
    const w = await mountSuspended(BenchTubeSorter)
    await type(w, '#sorter-readings', 'A1 30\nA2 thirty')
    expect(w.find('[data-field-error="sorter-readings"]').text()).toBe('line 2: "A2 thirty" has no reading at the end')
    expect(testid(w, 'sets').exists()).toBe(false)
  })
})
