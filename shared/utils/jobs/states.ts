// The job status flow. Only these moves are allowed; each is logged with who and when.
export const JOB_STATES = ['checked-in', 'on-bench', 'waiting-parts', 'soak', 'ready', 'handed-back', 'closed', 'cancelled'] as const
export type JobState = (typeof JOB_STATES)[number]

export const JOB_STATE_LABELS: Record<JobState, string> = {
  'checked-in': 'Checked in',
  'on-bench': 'On the bench',
  'waiting-parts': 'Waiting for parts',
  'soak': 'Soak',
  'ready': 'Ready',
  'handed-back': 'Handed back',
  'closed': 'Closed',
  'cancelled': 'Cancelled',
}

export const JOB_TRANSITIONS: Record<JobState, readonly JobState[]> = {
  'checked-in': ['on-bench', 'cancelled'],
  'on-bench': ['waiting-parts', 'soak', 'ready', 'checked-in', 'cancelled'],
  'waiting-parts': ['on-bench', 'cancelled'],
  'soak': ['on-bench', 'ready'],
  'ready': ['handed-back', 'on-bench'],
  'handed-back': ['closed', 'on-bench'],
  'closed': [],
  'cancelled': ['checked-in'],
}

export const canTransition = (from: JobState, to: JobState) => JOB_TRANSITIONS[from].includes(to)

/** States in which a job is still in the shop's hands (the board's default view). */
export const OPEN_JOB_STATES: readonly JobState[] = ['checked-in', 'on-bench', 'waiting-parts', 'soak', 'ready']

export const JOB_PRIORITIES = ['low', 'normal', 'rush'] as const
export type JobPriority = (typeof JOB_PRIORITIES)[number]
