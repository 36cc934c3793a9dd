import type { LibraryTube } from '../../types/tubes'
import { BUILTIN_TUBES, TUBE_FIGURES } from './builtin'
import type { TubeSpec } from './builtin'

/** A built-in spec in library form; its per-figure sources fold into one line when they agree. */
export function libraryTubeFromBuiltin(t: Readonly<TubeSpec>): LibraryTube {
  const distinct = [...new Set(TUBE_FIGURES.map(f => t.sources[f]))]
  return {
    id: t.id,
    name: t.name,
    maxPlateWatts: t.maxPlateWatts,
    maxScreenWatts: t.maxScreenWatts,
    maxPlateVolts: t.maxPlateVolts,
    heater: t.heater,
    ratingSystem: t.ratingSystem,
    source: distinct.join('; '),
    kind: 'builtin',
  }
}

export const BUILTIN_LIBRARY: readonly LibraryTube[] = Object.freeze(BUILTIN_TUBES.map(libraryTubeFromBuiltin))
