import { defineStore } from 'pinia'
import { STORAGE_KEYS } from '~/utils/storage-keys'

/** The e-mail switches are shop-internal: a player's copy leaves them out. */
export interface ShopSettings {
  name?: string
  address?: string
  phone?: string
  email?: string
  labourRateCents: number
  taxRateBasisPoints: number
  currency: string
  readyEmail?: boolean
  invoiceEmail?: boolean
  paymentEmail?: boolean
}

/** The shop's rates and currency: read from the server, kept on the device for offline defaults. */
export const useShopSettingsStore = defineStore('shopSettings', () => {
  const session = useSessionStore()
  const settings = ref<ShopSettings | null>(null)
  const error = ref('')
  const shopId = computed(() => session.activeShop?.id ?? null)

  watch(shopId, (id) => {
    try {
      settings.value = id && import.meta.client ? (JSON.parse(localStorage.getItem(STORAGE_KEYS.shopSettings(id)) ?? 'null') as ShopSettings | null) : null
    }
    catch {
      settings.value = null
    }
  }, { immediate: true })

  function keep(s: ShopSettings) {
    settings.value = s
    if (shopId.value) localStorage.setItem(STORAGE_KEYS.shopSettings(shopId.value), JSON.stringify(s))
  }

  async function load() {
    if (!shopId.value) return
    error.value = ''
    try {
      keep(await $fetch<ShopSettings>('/api/shop/settings'))
    }
    catch (e) {
      error.value = wordsOf(e)
    }
  }

  async function save(patch: Partial<ShopSettings>) {
    keep(await $fetch<ShopSettings>('/api/shop/settings', { method: 'PATCH', body: patch }))
    // The shop's name shows in the header and switcher.
    if (patch.name) await session.refresh()
  }

  const currency = computed(() => settings.value?.currency ?? 'USD')
  return { settings, error, currency, load, save }
})
