import { defineStore } from 'pinia'
import type { Member } from '~/stores/shop'
import { STORAGE_KEYS } from '~/utils/storage-keys'

function readCache(shopId: string): Member[] {
  try {
    return JSON.parse(localStorage.getItem(STORAGE_KEYS.shopPeople(shopId)) ?? '[]') as Member[]
  }
  catch {
    return []
  }
}

/** Who is in the shop (names for ids, techs to assign, players to link), kept for use offline. */
export const usePeopleStore = defineStore('people', () => {
  const session = useSessionStore()
  const members = ref<Member[]>([])
  const error = ref('')
  const shopId = computed(() => session.activeShop?.id ?? null)

  watch(shopId, (id) => {
    members.value = id && import.meta.client ? readCache(id) : []
  }, { immediate: true })

  async function load() {
    const id = shopId.value
    if (!id || !session.can('owner', 'tech', 'desk')) return
    error.value = ''
    try {
      members.value = (await $fetch<{ members: Member[] }>(`/api/shops/${id}/members`)).members
      localStorage.setItem(STORAGE_KEYS.shopPeople(id), JSON.stringify(members.value))
    }
    catch (e) {
      error.value = statusOf(e) === undefined ? 'The member list needs a connection; showing the last one seen.' : messageOf(e)
    }
  }

  const nameOf = (userId: string) => {
    if (userId === session.user?.id) return session.user.name
    return members.value.find(m => m.userId === userId)?.name ?? 'a shop member'
  }
  const techs = computed(() => members.value.filter(m => m.role === 'tech' || m.role === 'owner'))
  const players = computed(() => members.value.filter(m => m.role === 'player'))

  return { members, error, load, nameOf, techs, players }
})
