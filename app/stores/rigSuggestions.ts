import type { RigSuggestionRecord } from '#shared/types/records'

/**
 * Retube thresholds a shop suggests for a rig shared with it, kept in the shop on the device (so the
 * bench can suggest with no signal). The player pulls the ones for their own rigs.
 */
export const useRigSuggestionsStore = defineEntityStore('rigSuggestions', { noun: 'suggestion', order: newestFirst }, (base) => {
  const forRig = (rigId: string): RigSuggestionRecord[] => base.all.value.filter(s => s.rigId === rigId)
  const suggest = (rigId: string, retubeHours: number | null, retubeMonths: number | null, note = '', suggestedBy = '') =>
    base.create({ rigId, retubeHours, retubeMonths, note, suggestedBy })
  return { forRig, suggest }
})
