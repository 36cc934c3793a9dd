export type RatingSystem = 'design-centre' | 'design-maximum' | 'absolute-maximum'

export interface TubeFigures {
  maxPlateWatts: number
  /** null where the sheet gives no separate screen rating. */
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
  /** Where each figure comes from; a shop entry cites its own sheet. */
  sources: Record<TubeFigure, string>
}

// No data sheets were at hand when this table was written: every figure is
// recalled and marked so until someone checks it against the cited sheet.
const RECALLED = '(recalled, unverified)'

function allFrom(source: string): Record<TubeFigure, string> {
  const cited = `${source} ${RECALLED}`
  return { maxPlateWatts: cited, maxScreenWatts: cited, maxPlateVolts: cited, heater: cited, ratingSystem: cited }
}

const ENTRIES: TubeSpec[] = [
  {
    id: '6v6gt',
    name: '6V6GT',
    maxPlateWatts: 12,
    maxScreenWatts: 2,
    maxPlateVolts: 315,
    heater: '6.3 V 0.45 A',
    ratingSystem: 'design-centre',
    sources: allFrom('RCA 6V6GT data sheet'),
  },
  {
    id: '6v6gta',
    name: '6V6GTA',
    maxPlateWatts: 14,
    maxScreenWatts: 2.2,
    maxPlateVolts: 350,
    heater: '6.3 V 0.45 A',
    ratingSystem: 'design-maximum',
    sources: allFrom('RCA 6V6GTA data sheet'),
  },
  {
    id: 'el84',
    name: 'EL84',
    maxPlateWatts: 12,
    maxScreenWatts: 2,
    maxPlateVolts: 300,
    heater: '6.3 V 0.76 A',
    ratingSystem: 'design-centre',
    sources: allFrom('Philips EL84 data sheet'),
  },
  {
    id: '6l6gc',
    name: '6L6GC',
    maxPlateWatts: 30,
    maxScreenWatts: 5,
    maxPlateVolts: 500,
    heater: '6.3 V 0.9 A',
    ratingSystem: 'design-maximum',
    sources: allFrom('GE 6L6GC data sheet'),
  },
  {
    id: '5881',
    name: '5881',
    maxPlateWatts: 23,
    maxScreenWatts: 3,
    maxPlateVolts: 400,
    heater: '6.3 V 0.9 A',
    ratingSystem: 'design-centre',
    sources: allFrom('Tung-Sol 5881 data sheet'),
  },
  {
    id: 'el34',
    name: 'EL34',
    maxPlateWatts: 25,
    maxScreenWatts: 8,
    maxPlateVolts: 800,
    heater: '6.3 V 1.5 A',
    ratingSystem: 'design-centre',
    sources: allFrom('Telefunken EL34 data sheet'),
  },
  {
    id: 'kt66',
    name: 'KT66',
    maxPlateWatts: 25,
    maxScreenWatts: null,
    maxPlateVolts: 500,
    heater: '6.3 V 1.27 A',
    ratingSystem: 'design-centre',
    sources: {
      ...allFrom('GEC KT66 data sheet'),
      maxScreenWatts: `GEC KT66 data sheet: no separate screen dissipation figure recalled ${RECALLED}`,
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
    sources: allFrom('GEC KT88 data sheet, original rating'),
  },
  {
    id: 'kt88-42w',
    name: 'KT88 (later 42 W rating)',
    maxPlateWatts: 42,
    maxScreenWatts: 6,
    maxPlateVolts: 800,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-maximum',
    sources: allFrom('GEC KT88 data sheet, later rating'),
  },
  {
    id: '6550',
    name: '6550',
    maxPlateWatts: 35,
    maxScreenWatts: 6,
    maxPlateVolts: 600,
    heater: '6.3 V 1.6 A',
    ratingSystem: 'design-centre',
    sources: allFrom('Tung-Sol 6550 data sheet'),
  },
]

export const BUILTIN_TUBES: readonly Readonly<TubeSpec>[] = Object.freeze(ENTRIES.map(t => Object.freeze(t)))

export function findBuiltinTube(id: string): TubeSpec | undefined {
  return BUILTIN_TUBES.find(t => t.id === id)
}
