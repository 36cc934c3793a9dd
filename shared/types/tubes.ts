import type { RatingSystem } from '../utils/tubes/builtin'

/** One entry of the tube library as the app shows it: built in, or the shop's own. */
export interface LibraryTube {
  id: string
  name: string
  maxPlateWatts: number
  maxScreenWatts: number | null
  maxPlateVolts: number
  heater: string
  ratingSystem: RatingSystem
  /** Where the figures come from. */
  source: string
  kind: 'builtin' | 'shop'
}

export interface TubesPayload {
  tubes: LibraryTube[]
}
