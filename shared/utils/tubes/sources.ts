import type { RatingSystem } from './builtin'

/**
 * How well a built-in figure is backed. No maker's data sheet itself could be read when the
 * library was written; the class says what was read instead.
 */
export type SourceClass = 'S1' | 'S2' | 'M'

/** Every built-in source string ends with exactly one of these. */
export const SOURCE_CLASS_SUFFIX: Readonly<Record<SourceClass, string>> = Object.freeze({
  S1: '(S1)',
  S2: '(S2)',
  M: '(memory, unverified)',
})

export const SOURCE_CLASS_LABELS: Readonly<Record<SourceClass, string>> = Object.freeze({
  S1: 'S1',
  S2: 'S2',
  M: 'memory',
})

export const SOURCE_CLASS_EXPLAINED
  = 'S1: a handbook or encyclopedia page that cites the maker\'s sheet or manual. '
    + 'S2: a secondary copy, such as a build write-up or a forum post quoting a sheet. '
    + 'Memory: recalled, no copy found. No maker\'s sheet itself was read: check a figure against your own copy before you rely on it.'

/** The class a source string ends with, or undefined when it names none (a shop entry's own text). */
export function sourceClassOf(source: string): SourceClass | undefined {
  const text = source.trimEnd()
  return (Object.keys(SOURCE_CLASS_SUFFIX) as SourceClass[]).find(c => text.endsWith(SOURCE_CLASS_SUFFIX[c]))
}

/**
 * What each rating system means, in one sentence each. Sources: RCA, "Tube ratings and their
 * significance" (1943) and EIA RS-239-A (1963) for design centre and absolute maximum; EIA/JEDEC
 * TEP137 (JEDEC publication 37, 1962) for design maximum; TubeCAD Journal, Dec 2000, p. 19 for the
 * roughly 10 % difference.
 */
export const RATING_SYSTEM_EXPLAINED: Readonly<Record<RatingSystem, string>> = Object.freeze({
  'design-centre': 'Design centre: the limit holds for an average (bogey) tube at the nominal supply; the designer leaves room for supply swings and tube spread.',
  'design-maximum': 'Design maximum (from 1962): no tube may pass the limit even at the worst supply swing; a type re-rated this way reads roughly 10 % higher than under design centre.',
  'absolute-maximum': 'Absolute maximum: never to be passed by any tube under any condition, supply swings and tube spread included.',
})

export const RATING_SYSTEMS_DONT_MIX = 'Compare a limit only with limits of the same system: never a design-centre figure from one sheet with a design-maximum figure from another.'
