import type { RatingSystem, TubeFigure } from '../utils/tubes/builtin'

/** One entry of the tube library as the app shows it: built in, or the shop's own. */
export interface LibraryTube {
  id: string
  name: string
  maxPlateWatts: number
  maxScreenWatts: number | null
  maxPlateVolts: number
  heater: string
  ratingSystem: RatingSystem
  /** Where the figures come from (for a built-in entry: the plate rating's source). */
  source: string
  /** Built-in entries: each figure's source, ending with its backing class. */
  sources?: Record<TubeFigure, string>
  /** Built-in entries: a word beside a figure ("per section") or instead of a missing one. */
  notes?: Partial<Record<TubeFigure, string>>
  kind: 'builtin' | 'shop'
}

export interface TubesPayload {
  tubes: LibraryTube[]
}
