import { describe, expect, it } from 'vitest'
import { BUILTIN_TUBES, TUBE_FIGURES, findBuiltinTube } from '../../shared/utils/tubes/builtin'

const REQUIRED = ['6V6GT', '6V6GTA', 'EL84', '6L6GC', '5881', 'EL34', 'KT66', 'KT88', '6550']

describe('built-in tube library', () => {
  it('holds every required tube', () => {
    const names = BUILTIN_TUBES.map(t => t.name)
    for (const name of REQUIRED) expect(names).toContain(name)
  })

  it('has unique slug ids that find their entry', () => {
    const ids = BUILTIN_TUBES.map(t => t.id)
    expect(new Set(ids).size).toBe(ids.length)
    for (const t of BUILTIN_TUBES) {
      expect(t.id).toMatch(/^[a-z0-9]+(-[a-z0-9]+)*$/)
      expect(findBuiltinTube(t.id)).toBe(t)
    }
    expect(findBuiltinTube('nope')).toBeUndefined()
  })

  it('gives a source for every figure, and says when the figure is recalled', () => {
    for (const t of BUILTIN_TUBES) {
      expect(Object.keys(t.sources).sort()).toEqual([...TUBE_FIGURES].sort())
      for (const figure of TUBE_FIGURES) {
        const source = t.sources[figure]
        expect(source.trim().length, `${t.id}.${figure}`).toBeGreaterThan(10)
        expect(source, `${t.id}.${figure}`).toMatch(/data sheet/)
      }
    }
  })

  it('has positive numbers, a heater and a known rating system', () => {
    for (const t of BUILTIN_TUBES) {
      expect(t.maxPlateWatts).toBeGreaterThan(0)
      expect(t.maxPlateVolts).toBeGreaterThan(0)
      if (t.maxScreenWatts !== null) {
        expect(t.maxScreenWatts).toBeGreaterThan(0)
        expect(t.maxScreenWatts).toBeLessThan(t.maxPlateWatts)
      }
      expect(t.heater).toMatch(/^\d+(\.\d+)? V \d+(\.\d+)? A$/)
      expect(['design-centre', 'design-maximum', 'absolute-maximum']).toContain(t.ratingSystem)
    }
  })

  it('carries both 6V6 ratings: 12 W design-centre and 14 W design-maximum', () => {
    // Source: RCA 6V6GT and 6V6GTA data sheets (recalled from memory)
    expect(findBuiltinTube('6v6gt')).toMatchObject({ maxPlateWatts: 12, ratingSystem: 'design-centre' })
    expect(findBuiltinTube('6v6gta')).toMatchObject({ maxPlateWatts: 14, maxScreenWatts: 2.2, maxPlateVolts: 350, ratingSystem: 'design-maximum' })
  })

  it('matches the published maxima the library is built from', () => {
    // Source: Philips EL84, GE 6L6GC, Telefunken EL34, GEC KT66/KT88 data sheets (recalled from memory)
    expect(findBuiltinTube('el84')).toMatchObject({ maxPlateWatts: 12, maxScreenWatts: 2, maxPlateVolts: 300 })
    expect(findBuiltinTube('6l6gc')).toMatchObject({ maxPlateWatts: 30, maxScreenWatts: 5, maxPlateVolts: 500 })
    expect(findBuiltinTube('el34')).toMatchObject({ maxPlateWatts: 25, maxScreenWatts: 8, maxPlateVolts: 800 })
    expect(findBuiltinTube('kt66')).toMatchObject({ maxPlateWatts: 25, maxScreenWatts: null, maxPlateVolts: 500 })
    expect(findBuiltinTube('kt88')).toMatchObject({ maxPlateWatts: 35, maxScreenWatts: 6, maxPlateVolts: 800 })
    expect(findBuiltinTube('kt88-42w')).toMatchObject({ maxPlateWatts: 42 })
  })

  it('marks every figure as recalled until checked against a sheet', () => {
    for (const t of BUILTIN_TUBES) {
      for (const figure of TUBE_FIGURES) expect(t.sources[figure]).toMatch(/recalled, unverified/)
    }
  })

  it('cannot be changed at run time', () => {
    expect(Object.isFrozen(BUILTIN_TUBES)).toBe(true)
    expect(Object.isFrozen(BUILTIN_TUBES[0])).toBe(true)
  })
})
