import { describe, expect, it } from 'vitest'
import { BUILTIN_TUBES, TUBE_FIGURES, findBuiltinTube } from '../../shared/utils/tubes/builtin'
import type { TubeFigure, TubeFigures } from '../../shared/utils/tubes/builtin'
import { BUILTIN_LIBRARY } from '../../shared/utils/tubes/library'
import { SOURCE_CLASS_SUFFIX, sourceClassOf } from '../../shared/utils/tubes/sources'
import type { SourceClass } from '../../shared/utils/tubes/sources'

type Expected = { [F in TubeFigure]: [TubeFigures[F], SourceClass] }

// Source: ../shared/brief/SOURCES.md, "Power tubes" table, transcribed here by hand: each figure with
// the backing class that table gives it (an explicit "(M)" in a cell, else the row's backing).
// Where a type is maker-dependent or has two ratings, the comment says which one the entry holds.
const PUBLISHED: Record<string, Expected> = {
  // 6V6GT: 12 W S2 (a forum worked example); the rest M; 315 V design-centre, 350 V is the GTA's.
  '6v6gt': { maxPlateWatts: [12, 'S2'], maxScreenWatts: [2, 'M'], maxPlateVolts: [315, 'M'], heater: ['6.3 V 0.45 A', 'M'], ratingSystem: ['design-centre', 'M'] },
  // 6V6GTA: a build write-up's table, no maker named (S2); the system is M.
  '6v6gta': { maxPlateWatts: [14, 'S2'], maxScreenWatts: [2.2, 'S2'], maxPlateVolts: [350, 'S2'], heater: ['6.3 V 0.45 A', 'S2'], ratingSystem: ['design-maximum', 'M'] },
  // EL84 / 6BQ5: the Russian-language encyclopedia's EL84 article (S1), the whole row.
  'el84': { maxPlateWatts: [12, 'S1'], maxScreenWatts: [2, 'S1'], maxPlateVolts: [300, 'S1'], heater: ['6.3 V 0.76 A', 'S1'], ratingSystem: ['design-centre', 'S1'] },
  // 6L6GC: GE Essential Characteristics 1973 via the encyclopedia's 6L6 article (S1); screen 5 W and the system M.
  '6l6gc': { maxPlateWatts: [30, 'S1'], maxScreenWatts: [5, 'M'], maxPlateVolts: [500, 'S1'], heater: ['6.3 V 0.9 A', 'S1'], ratingSystem: ['design-maximum', 'M'] },
  // 5881: nothing found; every figure M.
  '5881': { maxPlateWatts: [23, 'M'], maxScreenWatts: [3, 'M'], maxPlateVolts: [400, 'M'], heater: ['6.3 V 0.9 A', 'M'], ratingSystem: ['design-centre', 'M'] },
  // EL34 / 6CA7: forum posts quoting makers' sheets (S2); 800 V is one maker's figure; screen 8 W and the system M.
  'el34': { maxPlateWatts: [25, 'S2'], maxScreenWatts: [8, 'M'], maxPlateVolts: [800, 'S2'], heater: ['6.3 V 1.5 A', 'S2'], ratingSystem: ['design-centre', 'M'] },
  // KT66: AWV 1962 and Iliffe 1966 via the encyclopedia's KT66 article (S1); the screen rating is published but was not found.
  'kt66': { maxPlateWatts: [25, 'S1'], maxScreenWatts: [null, 'M'], maxPlateVolts: [500, 'S1'], heater: ['6.3 V 1.27 A', 'S1'], ratingSystem: ['design-centre', 'M'] },
  // KT88: 35 W early, 42 W later, all M (only the KT88S variant was read).
  'kt88': { maxPlateWatts: [35, 'M'], maxScreenWatts: [6, 'M'], maxPlateVolts: [800, 'M'], heater: ['6.3 V 1.6 A', 'M'], ratingSystem: ['design-centre', 'M'] },
  'kt88-42w': { maxPlateWatts: [42, 'M'], maxScreenWatts: [6, 'M'], maxPlateVolts: [800, 'M'], heater: ['6.3 V 1.6 A', 'M'], ratingSystem: ['design-maximum', 'M'] },
  // 6550 (original, Tung-Sol 1955): the figures are M.
  '6550': { maxPlateWatts: [35, 'M'], maxScreenWatts: [6, 'M'], maxPlateVolts: [600, 'M'], heater: ['6.3 V 1.6 A', 'M'], ratingSystem: ['design-centre', 'M'] },
  // 6550A: 42 W design-maximum from GE 4-72 quoted in a code comment (S2); screen, plate volts and heater M
  // (6 W and 660 V are recalled from memory).
  '6550a': { maxPlateWatts: [42, 'S2'], maxScreenWatts: [6, 'M'], maxPlateVolts: [660, 'M'], heater: ['6.3 V 1.6 A', 'M'], ratingSystem: ['design-maximum', 'S2'] },
  // 12AX7 / ECC83: the Sylvania sheet via the encyclopedia's 12AX7 article (S1); 1 W per section; the system M.
  '12ax7': { maxPlateWatts: [1, 'S1'], maxScreenWatts: [null, 'S1'], maxPlateVolts: [300, 'S1'], heater: ['12.6 V 0.15 A or 6.3 V 0.3 A', 'S1'], ratingSystem: ['design-centre', 'M'] },
}

describe('built-in tube library', () => {
  it('holds exactly the tubes SOURCES.md lists figures for, the 6550 and 6550A apart', () => {
    // Source: SOURCES.md, "Power tubes" (7027A, KT77 and 6L6GB: nothing found, so not built in)
    expect(BUILTIN_TUBES.map(t => t.id).sort()).toEqual(Object.keys(PUBLISHED).sort())
    expect(findBuiltinTube('6550')!.name).toBe('6550')
    expect(findBuiltinTube('6550a')!.name).toBe('6550A')
    expect(BUILTIN_TUBES.find(t => ['7027a', 'kt77', '6l6gb'].includes(t.id))).toBeUndefined()
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

  it.each(Object.keys(PUBLISHED))('%s: every figure and its backing class as SOURCES.md gives them', (id) => {
    // Source: SOURCES.md, "Power tubes" (see PUBLISHED above)
    const tube = findBuiltinTube(id)!
    for (const figure of TUBE_FIGURES) {
      const [value, backing] = PUBLISHED[id]![figure]
      expect(tube[figure], `${id}.${figure}`).toBe(value)
      expect(sourceClassOf(tube.sources[figure]), `${id}.${figure}: ${tube.sources[figure]}`).toBe(backing)
    }
  })

  it('ends every source with exactly one class, and names a document or says it was not found', () => {
    // Source: SOURCES.md, "Classes" (S1, S2, or memory only)
    const suffixes = Object.values(SOURCE_CLASS_SUFFIX)
    for (const t of BUILTIN_TUBES) {
      expect(Object.keys(t.sources).sort()).toEqual([...TUBE_FIGURES].sort())
      for (const figure of TUBE_FIGURES) {
        const source = t.sources[figure]
        expect(suffixes.filter(s => source.includes(s)), `${t.id}.${figure}`).toHaveLength(1)
        expect(source).not.toMatch(/recalled, unverified/)
        if (sourceClassOf(source) === 'M') expect(source, `${t.id}.${figure}`).toMatch(/not found here/)
        else expect(source, `${t.id}.${figure}`).toMatch(/\(\d{4}\)|\d{4}|sheet|table|forum|data/)
      }
    }
  })

  it('cites the documents SOURCES.md names for the best-backed figures', () => {
    // Source: SOURCES.md, "Power tubes", backing column
    expect(findBuiltinTube('6l6gc')!.sources.maxPlateWatts).toMatch(/^General Electric, Essential Characteristics \(1973\), as cited in the encyclopedia's 6L6 article.*\(S1\)$/)
    expect(findBuiltinTube('kt66')!.sources.maxPlateWatts).toMatch(/AWV Super Radiotron Valve Manual \(1962\).*\(S1\)$/)
    expect(findBuiltinTube('6550a')!.sources.maxPlateWatts).toMatch(/General Electric 6550-A product information 4-72 \(April 1972\).*\(S2\)$/)
    expect(findBuiltinTube('12ax7')!.sources.maxPlateWatts).toMatch(/Sylvania.*12AX7 article.*\(S1\)$/)
    expect(findBuiltinTube('el84')!.sources.maxPlateWatts).toMatch(/Russian-language EL84 article.*\(S1\)$/)
  })

  it('stores no KT66 screen figure but says one is published, and the 12AX7 rating is per section', () => {
    // Source: SOURCES.md: KT66 "published but not found (do not store none)"; 12AX7 "1 per section"
    const kt66 = findBuiltinTube('kt66')!
    expect(kt66.maxScreenWatts).toBeNull()
    expect(kt66.notes?.maxScreenWatts).toBe('published, not found here')
    expect(kt66.sources.maxScreenWatts).toMatch(/published.*not found here/)
    expect(kt66.sources.maxScreenWatts).not.toMatch(/\bnone\b|no separate/i)
    const ax7 = findBuiltinTube('12ax7')!
    expect(ax7.notes?.maxPlateWatts).toBe('per section')
    expect(ax7.notes?.maxScreenWatts).toMatch(/triode/)
  })

  it('keeps one rating system per entry: the two 6V6 and the two KT88 ratings are separate entries', () => {
    // Source: SOURCES.md, "Rating systems": never mix design-centre and design-maximum figures
    expect(findBuiltinTube('6v6gt')).toMatchObject({ maxPlateWatts: 12, ratingSystem: 'design-centre' })
    expect(findBuiltinTube('6v6gta')).toMatchObject({ maxPlateWatts: 14, ratingSystem: 'design-maximum' })
    expect(findBuiltinTube('kt88')).toMatchObject({ maxPlateWatts: 35, ratingSystem: 'design-centre' })
    expect(findBuiltinTube('kt88-42w')).toMatchObject({ maxPlateWatts: 42, ratingSystem: 'design-maximum' })
  })

  it('has positive limits, a screen below the plate, and a heater in volts and amps', () => {
    for (const t of BUILTIN_TUBES) {
      expect(t.maxPlateWatts).toBeGreaterThan(0)
      expect(t.maxPlateVolts).toBeGreaterThan(0)
      if (t.maxScreenWatts !== null) expect(t.maxScreenWatts).toBeLessThan(t.maxPlateWatts)
      else expect(t.notes?.maxScreenWatts, t.id).toBeTruthy()
      expect(t.heater).toMatch(/^\d+(\.\d+)? V \d+(\.\d+)? A( or \d+(\.\d+)? V \d+(\.\d+)? A)?$/)
    }
  })

  it('carries every figure\'s source into the library the app and the API read', () => {
    for (const t of BUILTIN_LIBRARY) {
      const spec = findBuiltinTube(t.id)!
      expect(t.kind).toBe('builtin')
      expect(t.sources).toEqual(spec.sources)
      expect(t.source).toBe(`Plate rating: ${spec.sources.maxPlateWatts}`)
      expect(t.notes).toEqual(spec.notes)
    }
  })

  it('reads the class off a source string, and none off a shop\'s own text', () => {
    expect(sourceClassOf('Maker sheet (S1)')).toBe('S1')
    expect(sourceClassOf('a forum post (S2) ')).toBe('S2')
    expect(sourceClassOf('not found here (memory, unverified)')).toBe('M')
    expect(sourceClassOf('Shop copy of the maker\'s data sheet')).toBeUndefined()
    expect(sourceClassOf('(S1) at the start is not a class')).toBeUndefined()
  })

  it('cannot be changed at run time', () => {
    expect(Object.isFrozen(BUILTIN_TUBES)).toBe(true)
    expect(Object.isFrozen(BUILTIN_TUBES[0])).toBe(true)
    expect(Object.isFrozen(BUILTIN_TUBES[0]!.sources)).toBe(true)
  })
})
