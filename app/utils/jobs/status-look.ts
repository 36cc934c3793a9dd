// Each job state has its own word, colour and outline, so it reads without colour too.
import type { JobState } from '#shared/utils/jobs/states'

export interface StatusLook { tone: string, shape: string }

// 12-unit glyphs: a flag for arrival, a wrench-like bar on the bench, an hourglass while waiting,
// a wave for soak, a star for ready, an arrow out for handed back, a filled square when closed.
export const STATUS_LOOK: Record<JobState, StatusLook> = {
  'checked-in': { tone: 'text-band-cold border-band-cold', shape: 'M3 11V1.5M3 2h6.5L8 4.5l1.5 2.5H3' },
  'on-bench': { tone: 'text-accent border-accent', shape: 'M1.5 9.5h9M3 9.5V5h6v4.5M5 5V2.5h2V5' },
  'waiting-parts': { tone: 'text-muted border-muted', shape: 'M2.5 1.5h7L6 6l3.5 4.5h-7L6 6z' },
  'soak': { tone: 'text-band-warm border-band-warm', shape: 'M1 6c1.2-2 2.5-2 3.7 0s2.5 2 3.7 0 2.5-2 3.6 0' },
  'ready': { tone: 'text-band-ok border-band-ok', shape: 'M6 1l1.5 3.2 3.5.4-2.6 2.4.7 3.5L6 8.8 2.9 10.5l.7-3.5L1 4.6l3.5-.4z' },
  'handed-back': { tone: 'text-ink border-line', shape: 'M1.5 6h8M6.5 3l3 3-3 3' },
  'closed': { tone: 'text-muted border-line', shape: 'M2 2h8v8H2z' },
  'cancelled': { tone: 'text-band-over border-band-over', shape: 'M2.5 2.5l7 7M9.5 2.5l-7 7' },
}
