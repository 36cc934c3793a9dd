import { describe, expect, it } from 'vitest'
import { matchedSetPartDescription, nextStockLabel, parseStockReadings, readingText, setLabelText, stockTubeLabel } from '../../shared/utils/stock'

describe('stock words', () => {
  it('names the job part and the next labels', () => {
    expect(matchedSetPartDescription(2, '6L6GC', 'S-12')).toBe('Matched pair 6L6GC, set S-12')
    expect(matchedSetPartDescription(4, 'EL34', 'S-3')).toBe('Matched quad EL34, set S-3')
    expect(nextStockLabel('S-', ['S-3', 'S-12', 'L1-01', 'S-x'])).toBe('S-13')
    expect(nextStockLabel('S-', [])).toBe('S-1')
    expect(stockTubeLabel('Tube 3', 'L3', 6)).toBe('L3-07')
    expect(stockTubeLabel('A1', 'L3', 0)).toBe('A1')
  })

  it('puts every tube\'s reading and test point on the label the QR code carries', () => {
    const tube = { plateVolts: 400, gridVolts: -45, transconductance: 0.0056, testedOn: '2026-11-23', testedBy: 'Owen Pryde' }
    // Source: SI prefix m = 1e-3 (BIPM SI Brochure, 9th ed.): 0.0412 A = 41.2 mA, 0.0056 S = 5.6 mA/V
    expect(readingText({ ...tube, label: 'L1-01', amps: 0.0412 })).toBe('41.2 mA at 400 V plate, −45.0 V grid; 5.60 mA/V')
    const text = setLabelText({ label: 'S-1', size: 2, spreadFraction: 0.05 }, '6L6GC', [
      { ...tube, label: 'L1-01', amps: 0.040 },
      { ...tube, label: 'L1-02', amps: 0.042, transconductance: null },
    ])
    expect(text.split('\n')).toEqual([
      'Tubewright matched pair 6L6GC, set S-1',
      'spread 5.0 %',
      'L1-01: 40.0 mA at 400 V plate, −45.0 V grid; 5.60 mA/V; tested 2026-11-23 by Owen Pryde',
      'L1-02: 42.0 mA at 400 V plate, −45.0 V grid; tested 2026-11-23 by Owen Pryde',
    ])
  })
})

describe('parseStockReadings', () => {
  it('reads a label, the current in mA and an optional transconductance in mA/V', () => {
    // Source: SI prefix m = 1e-3 (BIPM SI Brochure, 9th ed.)
    const r = parseStockReadings('L3-07 34.5 5.2\n35.1 mA\nA3: 36 mA 6,1 mA/V\n\n')
    expect(r.errors).toEqual([])
    expect(r.readings.map(x => x.label)).toEqual(['L3-07', '', 'A3'])
    expect(r.readings[0]!.amps).toBeCloseTo(0.0345, 12)
    expect(r.readings[0]!.transconductance).toBeCloseTo(0.0052, 12)
    expect(r.readings[1]).toMatchObject({ transconductance: null })
    expect(r.readings[1]!.amps).toBeCloseTo(0.0351, 12)
    expect(r.readings[2]!.transconductance).toBeCloseTo(0.0061, 12)
  })

  it('names each line it cannot read', () => {
    const r = parseStockReadings('X -3\nY 1 2 3\nZ\nW 40 -2')
    expect(r.readings).toEqual([])
    expect(r.errors).toEqual([
      'line 1: the current must be above zero',
      'line 2: give the current, then (optionally) the transconductance in mA/V',
      'line 3: give the current, then (optionally) the transconductance in mA/V',
      'line 4: the transconductance must be a number of mA/V above zero',
    ])
  })
})
