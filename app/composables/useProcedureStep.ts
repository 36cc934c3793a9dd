import { checkRange, holdSeconds, readOutput, toolPresets, type ProcedureDefinition, type RunStep, type StepReading } from '#shared/utils/procedures/index'
import { formatQuantity, readQuantity } from '#shared/utils/units'
import type { RunRow } from '~/stores/procedures'

export interface ProcedureStepProps { procedure: ProcedureDefinition, run: RunRow, step: RunStep, position: number }

/**
 * One step of a run: what it reads (the tool's output, a typed reading, or a confirmation), whether
 * it may be recorded, and recording it (a reading out of range stops the run on this step).
 */
export function useProcedureStep(props: ProcedureStepProps, onRecorded: () => void) {
  const procedures = useProceduresStore()
  const measurements = useMeasurementsStore()

  const reading = computed<StepReading | undefined>(() => props.run.readings[props.step.key])
  const verdict = computed(() => checkRange(props.step.expect, reading.value?.value))
  const holdFor = computed(() => holdSeconds(props.step, props.run.readings))
  const held = ref(false)
  const confirmed = ref(false)
  const typed = ref('')
  const unit = ref(props.step.reading?.unit ?? '')
  const toolResult = ref<{ inputs: unknown, outputs: unknown } | null>(null)
  const busy = ref(false)
  const error = ref('')
  const ampTube = useAmpTube(() => props.run.jobId)
  // On a job, the tool starts with the amp's own power tube.
  const presets = computed(() => ({
    ...(ampTube.value ? { tubeId: ampTube.value.id } : {}),
    ...toolPresets(props.procedure, props.step, props.run.variant, props.run.readings),
  }))

  const typedValue = computed(() => {
    const r = props.step.reading
    if (!r || !typed.value.trim()) return { value: undefined, error: '' }
    const q = readQuantity(typed.value, { defaultUnit: unit.value, dimension: r.dimension })
    return q.ok ? { value: q.value, error: '' } : { value: undefined, error: `${r.label}: ${q.ok ? '' : q.error}` }
  })
  const toolValue = computed(() => {
    const t = props.step.tool
    if (!t || !toolResult.value) return undefined
    const v = readOutput(toolResult.value.outputs, t.record.output)
    return v === undefined ? undefined : v * (t.record.factor ?? 1)
  })
  const dimension = computed(() => props.step.tool?.record.dimension ?? props.step.reading?.dimension ?? 'count')
  const label = computed(() => props.step.tool?.record.label ?? props.step.reading?.label ?? '')
  const show = (v: number) => formatQuantity(v, dimension.value)

  const waiting = computed(() => holdFor.value > 0 && !held.value && !reading.value)
  const ready = computed(() => {
    if (waiting.value) return false
    if (props.step.tool) return toolValue.value !== undefined
    if (props.step.reading) return typedValue.value.value !== undefined
    return confirmed.value
  })
  const range = computed(() => {
    const e = props.step.expect
    if (!e) return ''
    if (e.min !== undefined && e.max !== undefined) return `${show(e.min)} to ${show(e.max)}`
    return e.max !== undefined ? `at most ${show(e.max)}` : `at least ${show(e.min!)}`
  })

  // The tool's full result goes on the job (or the notebook) like any other bench result.
  function saveToolResult(tool: NonNullable<RunStep['tool']>, result: { inputs: unknown, outputs: unknown }) {
    return measurements.save({
      tool: tool.id,
      inputs: JSON.parse(JSON.stringify(result.inputs)),
      outputs: JSON.parse(JSON.stringify(result.outputs)),
      label: `${props.procedure.title}: ${props.step.heading}`.slice(0, 200),
      attach: props.run.jobId ? { kind: 'job', id: props.run.jobId } : { kind: 'notebook' },
    })
  }

  async function markDone() {
    if (!ready.value || busy.value) return
    busy.value = true
    error.value = ''
    try {
      const at = new Date().toISOString()
      let value: number | undefined
      let measurementId: string | undefined
      if (props.step.tool && toolResult.value) {
        value = toolValue.value
        measurementId = await saveToolResult(props.step.tool, toolResult.value)
      }
      else if (props.step.reading) value = typedValue.value.value
      const r: StepReading = { ...(value === undefined ? {} : { value }), ...(measurementId ? { measurementId } : {}), at }
      const v = checkRange(props.step.expect, value)
      if (!v.ok) {
        await procedures.stopAt(props.run, props.step.key, r, v.reason)
        return
      }
      await procedures.record(props.run, props.step.key, r, props.position)
      onRecorded()
    }
    catch (e) {
      error.value = `Not saved: ${messageOf(e)}`
    }
    finally {
      busy.value = false
    }
  }

  async function measureAgain() {
    error.value = ''
    typed.value = ''
    try {
      await procedures.clearReading(props.run, props.step.key)
    }
    catch (e) {
      error.value = messageOf(e)
    }
  }

  async function endHere() {
    if (verdict.value.ok) return
    try {
      await procedures.end(props.run, `${props.step.heading}: ${verdict.value.reason}`)
    }
    catch (e) {
      error.value = messageOf(e)
    }
  }

  return { reading, verdict, holdFor, held, confirmed, typed, unit, toolResult, presets, typedValue, toolValue, label, show, waiting, ready, range, busy, error, markDone, measureAgain, endHere }
}
