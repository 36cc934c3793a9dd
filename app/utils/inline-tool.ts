import type { InjectionKey, Ref } from 'vue'
import type { BenchToolId } from '#shared/utils/bench/index'

/** A bench tool shown inside a procedure step: preset choices in, the live result out. */
export interface InlineToolContext {
  tool: BenchToolId
  /** Form values to set when the step opens (choices, values from earlier steps, cleared readings). */
  presets: Record<string, string>
  result: Ref<{ inputs: unknown, outputs: unknown } | null>
}

export const INLINE_TOOL: InjectionKey<InlineToolContext> = Symbol('inline-tool')
