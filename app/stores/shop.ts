import { defineStore } from 'pinia'
import type { Role } from '#shared/utils/roles'

export interface Member { userId: string, name: string, email: string, role: Role, since: string }
export interface Invitation { id: string, email: string, role: Role, expiresAt: string, link?: string, mailed?: boolean }

/** Shop membership management (owner), straight against the server: it needs a connection. */
export const useShopStore = defineStore('shop', () => {
  const members = ref<Member[]>([])
  const invitations = ref<Invitation[]>([])
  const loading = ref(false)
  const error = ref('')
  const lastInvite = ref<Invitation | null>(null)

  async function load(shopId: string, withInvitations: boolean) {
    loading.value = true
    error.value = ''
    try {
      members.value = (await $fetch<{ members: Member[] }>(`/api/shops/${shopId}/members`)).members
      invitations.value = withInvitations
        ? (await $fetch<{ invitations: Invitation[] }>(`/api/shops/${shopId}/invitations`)).invitations
        : []
    }
    catch (e) {
      error.value = statusOf(e) === undefined ? 'Members need a connection to the shop server.' : messageOf(e)
    }
    finally {
      loading.value = false
    }
  }

  async function invite(shopId: string, email: string, role: Role) {
    const inv = await $fetch<Invitation>(`/api/shops/${shopId}/invitations`, { method: 'POST', body: { email, role } })
    lastInvite.value = inv
    invitations.value = [inv, ...invitations.value]
  }

  async function revoke(shopId: string, id: string) {
    await $fetch(`/api/shops/${shopId}/invitations/${id}`, { method: 'DELETE' })
    invitations.value = invitations.value.filter(i => i.id !== id)
  }

  async function changeRole(shopId: string, userId: string, role: Role) {
    await $fetch(`/api/shops/${shopId}/members/${userId}`, { method: 'PATCH', body: { role } })
    members.value = members.value.map(m => (m.userId === userId ? { ...m, role } : m))
  }

  async function remove(shopId: string, userId: string) {
    await $fetch(`/api/shops/${shopId}/members/${userId}`, { method: 'DELETE' })
    members.value = members.value.filter(m => m.userId !== userId)
  }

  return { members, invitations, loading, error, lastInvite, load, invite, revoke, changeRole, remove }
})
