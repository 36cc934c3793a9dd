import { defineStore } from 'pinia'
import { canTransition, OPEN_JOB_STATES, type JobState } from '#shared/utils/jobs/states'
import type { EntityFields } from '#shared/utils/sync/entities'
import { countByStatus, filterBoard, sortBoard, type BoardJob, type BoardQuery, type BoardSort } from '~/utils/jobs/board'
import { validateCreate } from '~/utils/jobs/check-in'

export type JobInput = Partial<EntityFields<'jobs'>>

/** Jobs of the active shop, on the device, with what the board needs beside each. */
export const useJobsStore = defineStore('jobs', () => {
  const sync = useSyncStore()
  const session = useSessionStore()
  const customers = useCustomersStore()
  const amps = useAmpsStore()
  const people = usePeopleStore()
  const { list: rows, loaded } = useShopTable('jobs')

  const board = computed<BoardJob[]>(() => rows.value.map((job) => {
    const amp = amps.byId(job.ampId)
    return {
      job,
      customerName: customers.byId(job.customerId)?.name ?? '',
      ampDescription: amp?.description ?? '',
      ampSerial: amp?.serial ?? '',
      techName: job.assignedTo ? people.nameOf(job.assignedTo) : '',
    }
  }))
  const byId = (id: string) => rows.value.find(j => j.id === id)
  const boardRow = (id: string) => board.value.find(b => b.job.id === id)
  const open = computed(() => board.value.filter(b => OPEN_JOB_STATES.includes(b.job.status)))
  const myBench = computed(() => open.value.filter(b => b.job.assignedTo === session.user?.id))

  const list = (q: BoardQuery, sort: BoardSort) => sortBoard(filterBoard(board.value, q), sort)
  const counts = (q: Omit<BoardQuery, 'status'>) => countByStatus(board.value, q)

  async function create(fields: JobInput): Promise<string> {
    const v = validateCreate('jobs', fields)
    if (!v.ok) throw new Error(Object.values(v.errors)[0])
    const id = crypto.randomUUID()
    await sync.mutate('job.create', { id, ...v.value })
    return id
  }

  async function required(id: string) {
    const row = await sync.db?.jobs.get(id)
    if (!row) throw new Error('That job is not on this device.')
    return row
  }

  async function edit(id: string, fields: JobInput) {
    const row = await required(id)
    const changed = changedFields(row, fields)
    if (!Object.keys(changed).length) return false
    await sync.mutate('job.setFields', { id, fields: changed }, row.version)
    return true
  }

  /** Only the moves the status flow allows; the server records who and when. */
  async function move(id: string, to: JobState) {
    const row = await required(id)
    if (!canTransition(row.status, to)) throw new Error(`A job cannot go from ${row.status} to ${to}.`)
    await sync.mutate('job.setFields', { id, fields: { status: to } }, row.version)
  }

  return { all: rows, loaded, board, byId, boardRow, open, myBench, list, counts, create, edit, move }
})
