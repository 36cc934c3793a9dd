import { describe, expect, it } from 'vitest'
import { parseTubeReadings } from '../../shared/utils/tube-readings'

describe('parseTubeReadings', () => {
  it('reads a label and a reading per line, in mA unless a unit is typed', () => {
    const r = parseTubeReadings('A1 34.5\nA2: 35,1 mA\n\n0.0362 A\nV4 = 33 mA')
    expect(r.errors).toEqual([])
    expect(r.readings.map(x => x.id)).toEqual(['A1', 'A2', 'Tube 4', 'V4'])
    // Source: SI prefix m = 1e-3 (BIPM SI Brochure, 9th ed.)
    expect(r.readings[0]!.amps).toBeCloseTo(0.0345, 12)
    expect(r.readings[1]!.amps).toBeCloseTo(0.0351, 12)
    expect(r.readings[2]!.amps).toBeCloseTo(0.0362, 12)
    expect(r.readings[3]!.amps).toBeCloseTo(0.033, 12)
  })

  it('names the line of every problem', () => {
    const r = parseTubeReadings('A1 34\nA1 35\nB2 lots\nC3 -4\nD4 12 mV')
    expect(r.readings).toHaveLength(1)
    expect(r.errors).toEqual([
      'line 2: the label "A1" is used twice',
      'line 3: "B2 lots" has no reading at the end',
      'line 4: a reading must be above zero',
      'line 5: mV is a voltage; this needs a current',
    ])
  })
})
