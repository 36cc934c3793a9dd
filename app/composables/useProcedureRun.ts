import { evaluateRun, expandSteps, findProcedure } from '#shared/utils/procedures/index'

/**
 * The run screen's state, from the URL (/procedures/<id>/run/<runId>?step=<key>): the run, its
 * check, its expanded steps, which step shows, and the way to the next step or the finish.
 */
export function useProcedureRun() {
  const route = useRoute()
  const router = useRouter()
  const procedures = useProceduresStore()
  const session = useSessionStore()
  const procedureId = computed(() => String(route.params.id))
  const runId = computed(() => String(route.params.runId))
  const procedure = computed(() => findProcedure(procedureId.value))
  const run = computed(() => procedures.find(runId.value))
  const gate = computed(() => (run.value ? procedures.gateOf(run.value) : undefined))

  // No step opens without this run's own acknowledged safety check: anything else goes back to the check.
  watchEffect(async () => {
    if (!procedures.loaded || !procedure.value) return
    const ok = run.value && gate.value && run.value.procedureId === procedureId.value
    if (ok || (run.value?.procedureId === procedureId.value && await procedures.hasGatedRun(run.value.id))) return
    if (!run.value && await procedures.hasGatedRun(runId.value)) return
    await navigateTo({ path: `/procedures/${procedureId.value}`, query: { gate: 'needed', ...(run.value?.jobId ? { job: run.value.jobId } : {}) } }, { replace: true })
  })

  const counts = computed(() => (run.value ? { tubes: run.value.tubeCount, caps: run.value.capCount } : null))
  const steps = computed(() => (procedure.value && run.value && counts.value ? expandSteps(procedure.value, run.value.variant, counts.value) : []))
  const evaluation = computed(() => (procedure.value && run.value && counts.value
    ? evaluateRun(procedure.value, run.value.variant, counts.value, run.value.readings)
    : null))
  // A deep link may go back to a step already reached, never past the first one not yet done.
  const index = computed(() => {
    if (!run.value) return 0
    const wanted = steps.value.findIndex(s => s.key === route.query.step)
    const reached = Math.min(run.value.stepIndex, steps.value.length)
    return wanted >= 0 && wanted <= reached ? wanted : reached
  })
  const step = computed(() => steps.value[index.value])
  // Someone else's run is read here, not worked: only its runner (or an owner) records on it.
  const canWork = computed(() => !!run.value && (run.value.createdBy === session.user?.id || session.role === 'owner'))
  const showSummary = computed(() => !!run.value && (run.value.status !== 'running' || !step.value || !canWork.value))
  const finishing = ref(false)
  const error = ref('')

  function go(i: number) {
    const target = steps.value[i]
    void router.replace({ query: target ? { step: target.key } : { step: 'end' } })
  }

  async function finish() {
    if (!run.value) return
    finishing.value = true
    error.value = ''
    try {
      await procedures.finish(run.value)
    }
    catch (e) {
      error.value = messageOf(e)
    }
    finally {
      finishing.value = false
    }
  }

  return { loaded: computed(() => procedures.loaded), procedure, run, gate, steps, evaluation, index, step, canWork, showSummary, finishing, error, go, finish }
}
