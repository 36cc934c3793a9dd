import type { BenchToolId } from '#shared/utils/bench/index'

// Every key this app keeps in localStorage or IndexedDB, in one place.
export const STORAGE_KEYS = {
  me: 'tubewright.me',
  theme: 'tubewright.theme',
  /** The last inputs typed into one bench tool, kept on this device. */
  benchTool: (tool: BenchToolId) => `tubewright.bench.${tool}`,
  /** The shop's own tube-library entries, cached for use with no signal. */
  shopTubes: (shopId: string) => `tubewright.tubes.${shopId}`,
} as const
