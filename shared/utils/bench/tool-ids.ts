// The Bench's tools by id: plain data, so code that only names a tool loads no schema.
export const BENCH_TOOL_IDS = [
  'idle-dissipation',
  'cathode-resistor',
  'bias-supply',
  'clean-power',
  'cap-drain',
  'load-reflection',
  'rc-corner',
  'tube-sorter',
] as const

export type BenchToolId = (typeof BENCH_TOOL_IDS)[number]

export function isBenchToolId(value: unknown): value is BenchToolId {
  return typeof value === 'string' && (BENCH_TOOL_IDS as readonly string[]).includes(value)
}
