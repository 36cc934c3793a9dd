import { canTransition, OPEN_JOB_STATES, type JobState } from '#shared/utils/jobs/states'
import type { EntityFields } from '#shared/utils/sync/entities'
import { countByStatus, filterBoard, sortBoard, type BoardJob, type BoardQuery, type BoardSort } from '~/utils/jobs/board'

export type JobInput = Partial<EntityFields<'jobs'>>

/** Jobs of the active shop, on the device, with what the board needs beside each. */
export const useJobsStore = defineEntityStore('jobs', { noun: 'job' }, ({ all, required, edit }) => {
  const session = useSessionStore()
  const customers = useCustomersStore()
  const amps = useAmpsStore()
  const people = usePeopleStore()

  const board = computed<BoardJob[]>(() => all.value.map((job) => {
    const amp = amps.byId(job.ampId)
    return {
      job,
      customerName: customers.byId(job.customerId)?.name ?? '',
      ampDescription: amp?.description ?? '',
      ampSerial: amp?.serial ?? '',
      techName: job.assignedTo ? people.nameOf(job.assignedTo) : '',
    }
  }))
  const boardRow = (id: string) => board.value.find(b => b.job.id === id)
  const open = computed(() => board.value.filter(b => OPEN_JOB_STATES.includes(b.job.status)))
  const myBench = computed(() => open.value.filter(b => b.job.assignedTo === session.user?.id))

  const list = (q: BoardQuery, sort: BoardSort) => sortBoard(filterBoard(board.value, q), sort)
  const counts = (q: Omit<BoardQuery, 'status'>) => countByStatus(board.value, q)

  /** Only the moves the status flow allows; the server records who and when. */
  async function move(id: string, to: JobState) {
    const row = await required(id)
    if (!canTransition(row.status, to)) throw new Error(`A job cannot go from ${row.status} to ${to}.`)
    await edit(id, { status: to })
  }

  return { board, boardRow, open, myBench, list, counts, move }
})
