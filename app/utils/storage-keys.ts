import type { BenchToolId } from '#shared/utils/bench/index'

// Every key this app keeps in localStorage or IndexedDB (and the Web Lock it syncs under), in one place.
export const STORAGE_KEYS = {
  me: 'tubewright.me',
  theme: 'tubewright.theme',
  /** The last inputs typed into one bench tool, kept on this device. */
  benchTool: (tool: BenchToolId) => `tubewright.bench.${tool}`,
  /** The same, for the tool as shown inside a procedure step. */
  procedureTool: (tool: BenchToolId) => `tubewright.procedure-tool.${tool}`,
  /** When a procedure step's wait was started, so a reload resumes the wait instead of restarting it. */
  holdStart: (runId: string, stepKey: string) => `tubewright.hold.${runId}.${stepKey}`,
  /** The shop's own tube-library entries, cached for use with no signal. */
  shopTubes: (shopId: string) => `tubewright.tubes.${shopId}`,
  /** The shop's members (names for ids, techs to assign), cached for use with no signal. */
  shopPeople: (shopId: string) => `tubewright.people.${shopId}`,
  /** The shop's labour rate, tax rate and currency, cached for use with no signal. */
  shopSettings: (shopId: string) => `tubewright.settings.${shopId}`,
  /** Who signed out (or was signed out) with changes still waiting on this device. */
  unsent: 'tubewright.unsent',
  /** IndexedDB: one database per user, `tubewright-<userId>`. */
  localDbPrefix: 'tubewright-',
  /** Web Lock name prefix: one tab per user syncs at a time. */
  syncLockPrefix: 'tubewright-sync-',
} as const
