import { defineStore } from 'pinia'
import type { RigRecord } from '#shared/types/records'

export interface RigHistoryJob {
  id: string, shopName: string, status: string, createdAt: string, updatedAt: string, promisedFor: string
  readings: { tool: string, label: string | null, outputs: Record<string, unknown>, createdAt: string }[]
  notes: { title: string, body: string, createdAt: string }[]
}
export interface OnlineSuggestion { id: string, shopId: string, shopName: string, retubeHours: number | null, retubeMonths: number | null, note: string, suggestedBy: string, createdAt: string }
export type SharedRig = Omit<RigRecord, 'deleted' | 'pending'> & { access: 'own' | 'shared', playerUserId: string, playerName?: string }

/**
 * What lives with the shops, straight from the server (so it needs a connection): a rig's shop
 * history for its player, and, for shop staff, the rigs players share with the active shop.
 */
export const useRigsOnlineStore = defineStore('rigsOnline', () => {
  const history = ref<Record<string, RigHistoryJob[]>>({})
  const suggestions = ref<Record<string, OnlineSuggestion[]>>({})
  const shared = ref<SharedRig[]>([])
  const error = ref('')
  const loading = ref(false)

  async function run(fn: () => Promise<void>) {
    loading.value = true
    error.value = ''
    try {
      await fn()
    }
    catch (e) {
      error.value = wordsOf(e)
    }
    finally {
      loading.value = false
    }
  }

  const loadHistory = (rigId: string) => run(async () => {
    const r = await $fetch<{ history: RigHistoryJob[], suggestions: OnlineSuggestion[] }>(`/api/rigs/${rigId}`)
    history.value = { ...history.value, [rigId]: r.history }
    suggestions.value = { ...suggestions.value, [rigId]: r.suggestions }
  })

  const loadShared = () => run(async () => {
    shared.value = (await $fetch<{ items: SharedRig[] }>('/api/rigs')).items.filter(r => r.access === 'shared')
  })

  return { history, suggestions, shared, error, loading, loadHistory, loadShared }
})
