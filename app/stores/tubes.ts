import { defineStore } from 'pinia'
import type { LibraryTube, TubesPayload } from '#shared/types/tubes'
import type { TubeCreate, TubePatch } from '#shared/utils/schemas/tubes'
import { BUILTIN_LIBRARY } from '#shared/utils/tubes/library'
import { STORAGE_KEYS } from '~/utils/storage-keys'

function readCache(shopId: string): LibraryTube[] {
  try {
    const raw = localStorage.getItem(STORAGE_KEYS.shopTubes(shopId))
    return raw ? (JSON.parse(raw) as LibraryTube[]).filter(t => t.kind === 'shop') : []
  }
  catch {
    return []
  }
}

/** Built-in tubes are always there; the shop's entries come from the server and are cached for no signal. */
export const useTubesStore = defineStore('tubes', () => {
  const session = useSessionStore()
  const shopId = computed(() => session.activeShop?.id ?? null)
  const shopEntries = ref<LibraryTube[]>([])
  const loading = ref(false)
  const error = ref('')
  const loadedFor = ref<string | null>(null)

  watch(shopId, (id) => {
    shopEntries.value = id ? readCache(id) : []
    loadedFor.value = null
    error.value = ''
  }, { immediate: true })

  const all = computed<LibraryTube[]>(() => [...BUILTIN_LIBRARY, ...shopEntries.value])

  function keep(id: string, entries: LibraryTube[]) {
    if (id !== shopId.value) return
    shopEntries.value = [...entries].sort((a, b) => a.name.localeCompare(b.name))
    try {
      localStorage.setItem(STORAGE_KEYS.shopTubes(id), JSON.stringify(shopEntries.value))
    }
    catch { /* no room: the entries still show until the next reload */ }
  }

  async function load(force = false) {
    const id = shopId.value
    if (!id || loading.value || (!force && loadedFor.value === id)) return
    loading.value = true
    error.value = ''
    try {
      const { tubes } = await $fetch<TubesPayload>('/api/tubes')
      keep(id, tubes.filter(t => t.kind === 'shop'))
      loadedFor.value = id
    }
    catch (e) {
      error.value = statusOf(e) === undefined
        ? 'No connection: showing the shop entries this device last saw.'
        : messageOf(e)
    }
    finally {
      loading.value = false
    }
  }

  async function create(body: TubeCreate) {
    const id = shopId.value
    const tube = await $fetch<LibraryTube>('/api/tubes', { method: 'POST', body })
    if (id) keep(id, [...shopEntries.value, tube])
    return tube
  }

  async function update(tubeId: string, patch: TubePatch) {
    const id = shopId.value
    const tube = await $fetch<LibraryTube>(`/api/tubes/${encodeURIComponent(tubeId)}`, { method: 'PATCH', body: patch })
    if (id) keep(id, shopEntries.value.map(t => (t.id === tubeId ? tube : t)))
    return tube
  }

  async function retire(tubeId: string) {
    const id = shopId.value
    await $fetch(`/api/tubes/${encodeURIComponent(tubeId)}`, { method: 'DELETE' })
    if (id) keep(id, shopEntries.value.filter(t => t.id !== tubeId))
  }

  const find = (id: string) => all.value.find(t => t.id === id)

  return { all, shopEntries, loading, error, load, create, update, retire, find }
})
