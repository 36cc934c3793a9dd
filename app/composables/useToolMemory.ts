import type { BenchToolId } from '#shared/utils/bench/index'
import { STORAGE_KEYS } from '~/utils/storage-keys'
import { INLINE_TOOL } from '~/utils/bench-tools'

type FormState = Record<string, string>

function readSaved<T extends FormState>(key: string, defaults: T): Partial<T> {
  try {
    const raw = localStorage.getItem(key)
    const saved = raw ? (JSON.parse(raw) as Record<string, unknown>) : {}
    // Keep only keys this version of the form still has, so an old save cannot break it.
    return Object.fromEntries(
      Object.entries(saved).filter(([k, v]) => k in defaults && typeof v === 'string'),
    ) as Partial<T>
  }
  catch {
    return {}
  }
}

/** The tool's form as typed (text, units, choices), remembered on this device between visits. */
export function useToolMemory<T extends FormState>(tool: BenchToolId, defaults: T) {
  // Inside a procedure the tool keeps its own memory, so a step's presets never change the Bench screen.
  const inline = inject(INLINE_TOOL, null)
  const key = inline ? STORAGE_KEYS.procedureTool(tool) : STORAGE_KEYS.benchTool(tool)
  const presets = Object.fromEntries(Object.entries(inline?.presets ?? {}).filter(([k]) => k in defaults))
  const state = reactive({ ...defaults, ...readSaved(key, defaults), ...presets }) as T
  watch(state, (value) => {
    try {
      localStorage.setItem(key, JSON.stringify(value))
    }
    catch { /* storage full or blocked: the form still works, it just is not remembered */ }
  }, { deep: true })
  function reset() {
    Object.assign(state, defaults)
  }
  return { form: state, reset }
}
