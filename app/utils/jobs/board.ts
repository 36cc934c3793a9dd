// The job board's filtering, sorting and counting: pure, so tests and the table share them.
import { JOB_STATES, OPEN_JOB_STATES, type JobState } from '#shared/utils/jobs/states'
import type { JobRecord } from '#shared/types/records'

export type JobRow = JobRecord
/** A job with what the board shows beside it. */
export interface BoardJob {
  job: JobRow
  customerName: string
  ampDescription: string
  ampSerial: string
  techName: string
}

export type StatusFilter = JobState | 'open' | 'all'
export const BOARD_SORTS = ['promised', 'newest', 'updated', 'customer', 'status'] as const
export type BoardSort = (typeof BOARD_SORTS)[number]
export const BOARD_SORT_LABELS: Record<BoardSort, string> = {
  promised: 'Promised date',
  newest: 'Newest first',
  updated: 'Last changed',
  customer: 'Customer',
  status: 'Status',
}

export interface BoardQuery { status: StatusFilter, text: string, mine: string | null }

export function inStatus(job: JobRow, status: StatusFilter) {
  if (status === 'all') return true
  if (status === 'open') return OPEN_JOB_STATES.includes(job.status)
  return job.status === status
}

export function matchesBoardText(b: BoardJob, text: string) {
  const q = text.trim().toLowerCase()
  if (!q) return true
  return [b.customerName, b.ampSerial, b.ampDescription, b.job.complaint].some(t => t.toLowerCase().includes(q))
}

/** Text and "my bench" narrow the counts too; the status chip does not (it picks among them). */
export function filterBoard(rows: BoardJob[], q: BoardQuery): BoardJob[] {
  return rows.filter(b => inStatus(b.job, q.status) && matchesBoardText(b, q.text) && (!q.mine || b.job.assignedTo === q.mine))
}

export function countByStatus(rows: BoardJob[], q: Omit<BoardQuery, 'status'>): Record<StatusFilter, number> {
  const counts = Object.fromEntries([...JOB_STATES, 'open', 'all'].map(s => [s, 0])) as Record<StatusFilter, number>
  for (const b of filterBoard(rows, { ...q, status: 'all' })) {
    counts[b.job.status]++
    counts.all++
    if (OPEN_JOB_STATES.includes(b.job.status)) counts.open++
  }
  return counts
}

const cmp = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0)
/** Jobs with no promised date go last; ties fall back to the oldest check-in first. */
export function compareBoard(sort: BoardSort, a: BoardJob, b: BoardJob): number {
  switch (sort) {
    case 'promised': {
      const pa = a.job.promisedFor || '9999-99-99'
      const pb = b.job.promisedFor || '9999-99-99'
      return cmp(pa, pb) || cmp(a.job.createdAt, b.job.createdAt)
    }
    case 'newest':
      return cmp(b.job.createdAt, a.job.createdAt)
    case 'updated':
      return cmp(b.job.updatedAt, a.job.updatedAt)
    case 'customer':
      return a.customerName.localeCompare(b.customerName) || cmp(a.job.createdAt, b.job.createdAt)
    case 'status':
      return JOB_STATES.indexOf(a.job.status) - JOB_STATES.indexOf(b.job.status) || cmp(a.job.createdAt, b.job.createdAt)
  }
}

export const sortBoard = (rows: BoardJob[], sort: BoardSort) => [...rows].sort((a, b) => compareBoard(sort, a, b))
