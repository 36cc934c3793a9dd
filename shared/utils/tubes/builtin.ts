import { SOURCE_CLASS_SUFFIX } from './sources'

export type RatingSystem = 'design-centre' | 'design-maximum' | 'absolute-maximum'

export interface TubeFigures {
  maxPlateWatts: number
  /** null where no screen figure is stored; the entry's notes say why. */
  maxScreenWatts: number | null
  maxPlateVolts: number
  heater: string
  ratingSystem: RatingSystem
}

export type TubeFigure = keyof TubeFigures

export const TUBE_FIGURES: readonly TubeFigure[] = Object.freeze([
  'maxPlateWatts',
  'maxScreenWatts',
  'maxPlateVolts',
  'heater',
  'ratingSystem',
])

export interface TubeSpec extends TubeFigures {
  id: string
  name: string
  /** Where each figure comes from, ending with its backing class (see ./sources). */
  sources: Record<TubeFigure, string>
  /** A word shown beside a figure ("per section") or instead of a missing one ("published, not found here"). */
  notes?: Partial<Record<TubeFigure, string>>
}

// What each figure stands on: see SOURCE_CLASS_EXPLAINED. Every source string ends with its
// class, so the Tubes screen can show it beside the figure and a test can check it.
const S1 = SOURCE_CLASS_SUFFIX.S1
const S2 = SOURCE_CLASS_SUFFIX.S2
const M = SOURCE_CLASS_SUFFIX.M

const ENCYCLOPEDIA = (article: string) => `as cited in the encyclopedia's ${article} article`

const ENTRIES: TubeSpec[] = [
  {
    id: '6v6gt',
    name: '6V6GT',
    maxPlateWatts: 12,
    maxScreenWatts: 2,
    maxPlateVolts: 315,
    heater: '6.3 V 0.45 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `6V6GT sheet, 12 W design centre, as used in a forum post's worked example ${S2}`,
      maxScreenWatts: `6V6GT sheet, not found here ${M}`,
      maxPlateVolts: `6V6GT sheet, 315 V design centre, not found here; 350 V is the 6V6GTA's figure ${M}`,
      heater: `6V6GT sheet, not found here ${M}`,
      ratingSystem: `6V6GT sheet's rating system, not found here ${M}`,
    },
  },
  {
    id: '6v6gta',
    name: '6V6GTA',
    maxPlateWatts: 14,
    maxScreenWatts: 2.2,
    maxPlateVolts: 350,
    heater: '6.3 V 0.45 A',
    ratingSystem: 'design-maximum',
    sources: {
      maxPlateWatts: `6V6GTA ratings table in a build write-up (no maker named) ${S2}`,
      maxScreenWatts: `6V6GTA ratings table in a build write-up (no maker named) ${S2}`,
      maxPlateVolts: `6V6GTA ratings table in a build write-up (no maker named); screen 315 V ${S2}`,
      heater: `6V6GTA ratings table in a build write-up (no maker named) ${S2}`,
      ratingSystem: `6V6GTA sheet's rating system, not found here ${M}`,
    },
  },
  {
    id: 'el84',
    name: 'EL84',
    maxPlateWatts: 12,
    maxScreenWatts: 2,
    maxPlateVolts: 300,
    heater: '6.3 V 0.76 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `EL84 (6BQ5) makers' data, ${ENCYCLOPEDIA('Russian-language EL84')} ${S1}`,
      maxScreenWatts: `EL84 (6BQ5) makers' data, ${ENCYCLOPEDIA('Russian-language EL84')} ${S1}`,
      maxPlateVolts: `EL84 (6BQ5) makers' data, ${ENCYCLOPEDIA('Russian-language EL84')}; screen 300 V, anode current 65 mA ${S1}`,
      heater: `EL84 (6BQ5) makers' data, ${ENCYCLOPEDIA('Russian-language EL84')} ${S1}`,
      ratingSystem: `EL84 (6BQ5) makers' data, ${ENCYCLOPEDIA('Russian-language EL84')} ${S1}`,
    },
  },
  {
    id: '6l6gc',
    name: '6L6GC',
    maxPlateWatts: 30,
    maxScreenWatts: 5,
    maxPlateVolts: 500,
    heater: '6.3 V 0.9 A',
    ratingSystem: 'design-maximum',
    sources: {
      maxPlateWatts: `General Electric, Essential Characteristics (1973), ${ENCYCLOPEDIA('6L6')}; a 2018 magazine article on choosing power tubes also gives 30 W (the original 6L6: 19 W) ${S1}`,
      maxScreenWatts: `6L6GC sheet, not found here ${M}`,
      maxPlateVolts: `General Electric, Essential Characteristics (1973), ${ENCYCLOPEDIA('6L6')}; the screen's 450 V is from memory ${S1}`,
      heater: `General Electric, Essential Characteristics (1973), ${ENCYCLOPEDIA('6L6')} ${S1}`,
      ratingSystem: `6L6GC sheet's rating system, not found here ${M}`,
    },
  },
  {
    id: '5881',
    name: '5881',
    maxPlateWatts: 23,
    maxScreenWatts: 3,
    maxPlateVolts: 400,
    heater: '6.3 V 0.9 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `5881 sheet, not found here (the type was introduced in "5881, a new beam power tube", Radio & Television News, Sept 1950) ${M}`,
      maxScreenWatts: `5881 sheet, not found here ${M}`,
      maxPlateVolts: `5881 sheet, not found here ${M}`,
      heater: `5881 sheet, not found here ${M}`,
      ratingSystem: `5881 sheet, not found here ${M}`,
    },
  },
  {
    id: 'el34',
    name: 'EL34',
    maxPlateWatts: 25,
    maxScreenWatts: 8,
    maxPlateVolts: 800,
    heater: '6.3 V 1.5 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `EL34 (6CA7) makers' sheets, quoted in forum posts ${S2}`,
      maxScreenWatts: `EL34 sheet, not found here ${M}`,
      maxPlateVolts: `one maker's EL34 sheet, quoted in a forum post; 750 V is reported for another maker: the figure depends on the maker ${S2}`,
      heater: `EL34 (6CA7) makers' sheets, quoted in forum posts ${S2}`,
      ratingSystem: `EL34 sheet, not found here ${M}`,
    },
  },
  {
    id: 'kt66',
    name: 'KT66',
    maxPlateWatts: 25,
    maxScreenWatts: null,
    maxPlateVolts: 500,
    heater: '6.3 V 1.27 A',
    ratingSystem: 'design-centre',
    notes: { maxScreenWatts: 'published, not found here' },
    sources: {
      maxPlateWatts: `AWV Super Radiotron Valve Manual (1962) and Iliffe Radio Valve Data, 8th ed. (1966), ${ENCYCLOPEDIA('KT66')} ${S1}`,
      maxScreenWatts: `KT66 screen rating: published in the makers' sheets, not found here, so no figure is stored ${M}`,
      maxPlateVolts: `AWV Super Radiotron Valve Manual (1962) and Iliffe Radio Valve Data, 8th ed. (1966), ${ENCYCLOPEDIA('KT66')} ${S1}`,
      heater: `AWV Super Radiotron Valve Manual (1962) and Iliffe Radio Valve Data, 8th ed. (1966), ${ENCYCLOPEDIA('KT66')} ${S1}`,
      ratingSystem: `KT66 sheet, not found here ${M}`,
    },
  },
  {
    id: 'kt88',
    name: 'KT88',
    maxPlateWatts: 35,
    maxScreenWatts: 6,
    maxPlateVolts: 800,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `KT88 sheet, original 35 W rating, not found here (the KT88 outrates the 6550, ${ENCYCLOPEDIA('KT88')}) ${M}`,
      maxScreenWatts: `KT88 sheet, not found here ${M}`,
      maxPlateVolts: `KT88 sheet, not found here ${M}`,
      heater: `KT88 sheet, not found here; the KT88S variant's Philips sheet gives about 1.6 A ${M}`,
      ratingSystem: `KT88 sheet, not found here ${M}`,
    },
  },
  {
    id: 'kt88-42w',
    name: 'KT88 (later 42 W rating)',
    maxPlateWatts: 42,
    maxScreenWatts: 6,
    maxPlateVolts: 800,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-maximum',
    sources: {
      maxPlateWatts: `KT88 sheet, later 42 W rating, not found here (the KT88S variant reads 50 W absolute maximum in Philips data) ${M}`,
      maxScreenWatts: `KT88 sheet, not found here ${M}`,
      maxPlateVolts: `KT88 sheet, not found here ${M}`,
      heater: `KT88 sheet, not found here; the KT88S variant's Philips sheet gives about 1.6 A ${M}`,
      ratingSystem: `KT88 sheet, not found here ${M}`,
    },
  },
  {
    id: '6550',
    name: '6550',
    maxPlateWatts: 35,
    maxScreenWatts: 6,
    maxPlateVolts: 600,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-centre',
    sources: {
      maxPlateWatts: `original 6550 (Tung-Sol, 1955, ${ENCYCLOPEDIA('6550')}); its figures were not found here ${M}`,
      maxScreenWatts: `original 6550 sheet, not found here ${M}`,
      maxPlateVolts: `original 6550 sheet, not found here ${M}`,
      heater: `original 6550 sheet, not found here ${M}`,
      ratingSystem: `original 6550 sheet, not found here ${M}`,
    },
  },
  {
    id: '6550a',
    name: '6550A',
    maxPlateWatts: 42,
    maxScreenWatts: 6,
    maxPlateVolts: 660,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-maximum',
    sources: {
      maxPlateWatts: `General Electric 6550-A product information 4-72 (April 1972), quoted in a public code comment ${S2}`,
      maxScreenWatts: `6550A sheet, not found here ${M}`,
      maxPlateVolts: `6550A sheet, not found here ${M}`,
      heater: `6550A sheet, not found here ${M}`,
      ratingSystem: `General Electric 6550-A product information 4-72 (April 1972), quoted in a public code comment ${S2}`,
    },
  },
  {
    id: '12ax7',
    name: '12AX7',
    maxPlateWatts: 1,
    maxScreenWatts: null,
    maxPlateVolts: 300,
    heater: '12.6 V 0.15 A or 6.3 V 0.3 A',
    ratingSystem: 'design-centre',
    notes: { maxPlateWatts: 'per section', maxScreenWatts: 'no screen (triode)' },
    sources: {
      maxPlateWatts: `Sylvania 12AX7 sheet, ${ENCYCLOPEDIA('12AX7')}; the later 12AX7A's 1.2 W and 330 V are from memory ${S1}`,
      maxScreenWatts: `a triode has no screen grid; Sylvania 12AX7 sheet, ${ENCYCLOPEDIA('12AX7')} ${S1}`,
      maxPlateVolts: `Sylvania 12AX7 sheet, ${ENCYCLOPEDIA('12AX7')} ${S1}`,
      heater: `Sylvania 12AX7 sheet, ${ENCYCLOPEDIA('12AX7')}: series or parallel heater halves ${S1}`,
      ratingSystem: `12AX7 sheet's rating system, not found here ${M}`,
    },
  },
]

function deepFreeze(t: TubeSpec): Readonly<TubeSpec> {
  Object.freeze(t.sources)
  if (t.notes) Object.freeze(t.notes)
  return Object.freeze(t)
}

export const BUILTIN_TUBES: readonly Readonly<TubeSpec>[] = Object.freeze(ENTRIES.map(deepFreeze))

export function findBuiltinTube(id: string): TubeSpec | undefined {
  return BUILTIN_TUBES.find(t => t.id === id)
}
