import { powerTubeOf } from '~/utils/jobs/amp-tube'

/** The power tube of the amp on a job (from its tube complement), when the job and amp are on this device. */
export function useAmpTube(jobId: () => string | null) {
  const jobs = useJobsStore()
  const amps = useAmpsStore()
  const tubes = useTubesStore()
  return computed(() => {
    const id = jobId()
    const job = id ? jobs.byId(id) : undefined
    const amp = job ? amps.byId(job.ampId) : undefined
    return amp ? powerTubeOf(amp.tubeComplement, tubes.all) : undefined
  })
}
