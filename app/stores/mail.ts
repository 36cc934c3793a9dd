import { defineStore } from 'pinia'

export interface SentMail { id: string, to: string, subject: string, body: string, delivered: boolean, retrying: boolean, createdAt: string }

/** The shop's sent e-mail (owner): straight from the server, so it needs a connection. */
export const useMailStore = defineStore('mail', () => {
  const items = ref<SentMail[]>([])
  const loading = ref(false)
  const error = ref('')

  async function load() {
    loading.value = true
    error.value = ''
    try {
      items.value = (await $fetch<{ items: SentMail[] }>('/api/mail')).items
    }
    catch (e) {
      error.value = wordsOf(e)
    }
    finally {
      loading.value = false
    }
  }

  return { items, loading, error, load }
})
