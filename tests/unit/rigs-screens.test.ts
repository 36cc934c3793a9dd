import { describe, expect, it } from 'vitest'
import { parseTubeList, powerTubes, tubeListText } from '../../app/utils/rigs/tube-list'
import { plotSeries } from '../../app/utils/rigs/chart'

describe('a rig\'s tubes as typed', () => {
  it('reads socket then tube, separated by commas, semicolons or lines', () => {
    const r = parseTubeList('V1 12AX7, V4 6L6GC;\nV5  6L6GC')
    expect(r).toEqual({ tubes: [{ position: 'V1', type: '12AX7' }, { position: 'V4', type: '6L6GC' }, { position: 'V5', type: '6L6GC' }], error: '' })
    expect(tubeListText(r.tubes)).toBe('V1 12AX7, V4 6L6GC, V5 6L6GC')
    expect(powerTubes(r.tubes).map(t => t.position)).toEqual(['V4', 'V5'])
    expect(parseTubeList('V1 12AX7, V4').error).toMatch(/"V4": write the socket then the tube/)
    expect(parseTubeList('  ')).toEqual({ tubes: [], error: '' })
  })
})

describe('the readings chart', () => {
  const box = { width: 320, height: 180, pad: { left: 30, right: 10, top: 10, bottom: 20 } }
  it('puts the oldest reading at the left edge, the newest at the right, higher mA higher up', () => {
    const p = plotSeries([
      { position: 'V4', points: [{ on: '2026-01-01', mA: 30 }, { on: '2026-01-11', mA: 40 }] },
      { position: 'V5', points: [{ on: '2026-01-06', mA: 35 }] },
    ], box)
    const [a, b] = p.series[0]!.points
    expect(a!.x).toBe(30)
    expect(b!.x).toBe(310)
    // Halfway in time is halfway across: (30 + 310) / 2.
    expect(p.series[1]!.points[0]!.x).toBe(170)
    expect(b!.y).toBeLessThan(a!.y)
    expect(p.mA).toEqual({ min: 29, max: 41 })
    expect(p.days).toEqual({ first: '2026-01-01', last: '2026-01-11' })
    for (const pt of p.series.flatMap(s => s.points)) {
      expect(pt.y).toBeGreaterThanOrEqual(box.pad.top)
      expect(pt.y).toBeLessThanOrEqual(box.height - box.pad.bottom)
    }
  })

  it('plots a single reading in the middle, and nothing for no readings', () => {
    const p = plotSeries([{ position: 'V4', points: [{ on: '2026-01-01', mA: 30 }] }], box)
    expect(p.series[0]!.points[0]!.x).toBe(170)
    expect(plotSeries([], box).series).toEqual([])
  })
})
