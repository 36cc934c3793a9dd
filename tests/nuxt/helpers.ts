import type { VueWrapper } from '@vue/test-utils'
import { flushPromises } from '@vue/test-utils'

/** Clicks the radio-style option whose text starts with `label`. */
export async function choose(wrapper: VueWrapper, label: string) {
  const button = wrapper.findAll('button[role="radio"]').find(b => b.text().startsWith(label))
  if (!button) throw new Error(`no option "${label}"`)
  await button.trigger('click')
  await flushPromises()
}

export async function type(wrapper: VueWrapper, selector: string, value: string) {
  await wrapper.find(selector).setValue(value)
  await flushPromises()
}

export const testid = (wrapper: VueWrapper, id: string) => wrapper.find(`[data-testid="${id}"]`)

/** The message shown beside a field (linked to it by aria-describedby). */
export function fieldError(wrapper: VueWrapper, id: string) {
  return wrapper.find(`#${id}-error`)
}
