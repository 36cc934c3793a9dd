import { defineStore } from 'pinia'
import type { MePayload } from '#shared/types/me'
import type { Role } from '#shared/utils/roles'
import { STORAGE_KEYS } from '~/utils/storage-keys'
import { can as canDo, type RecordKind, type Verb } from '#shared/utils/permissions'

function readCached(): MePayload | null {
  try {
    const raw = localStorage.getItem(STORAGE_KEYS.me)
    return raw ? (JSON.parse(raw) as MePayload) : null
  }
  catch {
    return null
  }
}

export const statusOf = (e: unknown) => (e as { statusCode?: number, response?: { status?: number } })?.statusCode
  ?? (e as { response?: { status?: number } })?.response?.status
export const messageOf = (e: unknown) => (e as { data?: { message?: string } })?.data?.message
  ?? (e as Error)?.message ?? 'Something went wrong.'

export const useSessionStore = defineStore('session', () => {
  // The last known user stays usable offline; only a real 401 from the server signs out.
  const me = ref<MePayload | null>(import.meta.client ? readCached() : null)
  const checked = ref(false)
  const reachable = ref(true)

  const user = computed(() => me.value?.user ?? null)
  const activeShop = computed(() => me.value?.activeShop ?? null)
  const role = computed<Role | null>(() => me.value?.activeShop?.role ?? null)
  const signedIn = computed(() => !!me.value)

  function set(payload: MePayload | null) {
    me.value = payload
    if (payload) localStorage.setItem(STORAGE_KEYS.me, JSON.stringify(payload))
    else localStorage.removeItem(STORAGE_KEYS.me)
  }

  async function refresh() {
    try {
      set(await $fetch<MePayload>('/api/auth/me'))
      reachable.value = true
    }
    catch (e) {
      if (statusOf(e) === 401) set(null)
      else reachable.value = false
    }
    finally {
      checked.value = true
    }
  }

  async function signIn(email: string, password: string) {
    set(await $fetch<MePayload>('/api/auth/login', { method: 'POST', body: { email, password } }))
  }

  async function register(body: { name: string, email: string, password: string, invitationToken?: string }) {
    set(await $fetch<MePayload>('/api/auth/register', { method: 'POST', body }))
  }

  async function signOut() {
    await $fetch('/api/auth/logout', { method: 'POST' }).catch(() => {})
    set(null)
  }

  /** Other devices are signed out by the server; this one stays signed in. */
  async function changePassword(currentPassword: string, newPassword: string) {
    return await $fetch<{ ok: true, endedSessions: number }>('/api/auth/password', { method: 'POST', body: { currentPassword, newPassword } })
  }

  async function switchShop(shopId: string) {
    set(await $fetch<MePayload>('/api/auth/active-shop', { method: 'POST', body: { shopId } }))
  }

  async function createShop(name: string) {
    set(await $fetch<MePayload>('/api/shops', { method: 'POST', body: { name } }))
  }

  async function acceptInvitation(token: string) {
    set(await $fetch<MePayload>(`/api/invitations/${encodeURIComponent(token)}/accept`, { method: 'POST' }))
  }

  const can = (...roles: Role[]) => !!role.value && roles.includes(role.value)
  /** What the permissions table (the server's own) lets this person do in the active shop. */
  const may = (record: RecordKind, verb: Verb, opts: { mine?: boolean } = {}) => !!role.value && canDo(role.value, record, verb, opts)

  return { me, checked, reachable, user, activeShop, role, signedIn, refresh, signIn, register, signOut, changePassword, switchShop, createShop, acceptInvitation, can, may }
})
