import type { LibraryTube } from '../../types/tubes'
import { BUILTIN_TUBES } from './builtin'
import type { TubeSpec } from './builtin'

/**
 * A built-in spec in library form. `source` is the plate rating's source, the figure the bench
 * tools use; every figure's own source (with its backing class) travels in `sources`.
 */
export function libraryTubeFromBuiltin(t: Readonly<TubeSpec>): LibraryTube {
  return {
    id: t.id,
    name: t.name,
    maxPlateWatts: t.maxPlateWatts,
    maxScreenWatts: t.maxScreenWatts,
    maxPlateVolts: t.maxPlateVolts,
    heater: t.heater,
    ratingSystem: t.ratingSystem,
    source: `Plate rating: ${t.sources.maxPlateWatts}`,
    sources: { ...t.sources },
    ...(t.notes ? { notes: { ...t.notes } } : {}),
    kind: 'builtin',
  }
}

export const BUILTIN_LIBRARY: readonly LibraryTube[] = Object.freeze(BUILTIN_TUBES.map(libraryTubeFromBuiltin))
