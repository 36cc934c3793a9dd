import { defineStore } from 'pinia'
import type { InvoiceRecord } from '#shared/types/records'

const PAY_POLL_MS = 2_000
const PAY_POLL_LIMIT = 90


/**
 * Estimates and invoices. The server writes them (numbers, totals, payment), so the list comes
 * from sync pull and every action here needs a connection.
 */
export const useInvoicesStore = defineStore('invoices', () => {
  const sync = useSyncStore()
  const rows = useShopTable('invoices').list
  const forJob = (jobId: string) => rows.value.filter(i => i.jobId === jobId).sort((a, b) => a.number - b.number)
  const byId = (id: string) => rows.value.find(i => i.id === id)
  /** Invoices whose payment went to the payment service and is not yet confirmed. */
  const paying = ref<string[]>([])

  async function create(jobId: string, kind: InvoiceRecord['kind']) {
    const inv = await $fetch<{ id: string }>(`/api/jobs/${jobId}/invoices`, { method: 'POST', body: { kind } })
    sync.syncNow()
    return inv.id
  }

  async function setState(id: string, state: 'sent' | 'void') {
    await $fetch(`/api/invoices/${id}`, { method: 'PATCH', body: { state } })
    sync.syncNow()
  }

  const fetchOne = (id: string) => $fetch<Record<string, unknown>>(`/api/invoices/${id}`)

  /** Starts a payment; the webhook marks it paid and the change arrives through sync. */
  async function pay(id: string) {
    const r = await $fetch<{ paymentId: string, status: string }>(`/api/invoices/${id}/pay`, { method: 'POST' })
    if (!paying.value.includes(id)) paying.value = [...paying.value, id]
    void waitForPaid(id)
    return r
  }

  async function waitForPaid(id: string) {
    for (let i = 0; i < PAY_POLL_LIMIT; i++) {
      sync.syncNow()
      await new Promise(r => setTimeout(r, PAY_POLL_MS))
      if (byId(id)?.state === 'paid') break
    }
    paying.value = paying.value.filter(p => p !== id)
  }

  /** Cash or card taken at the counter: paid at once, for exactly the total shown. */
  async function takeAtCounter(id: string, method: 'cash' | 'card', amountCents: number) {
    await $fetch(`/api/invoices/${id}/counter-payment`, { method: 'POST', body: { method, amountCents } })
    sync.syncNow()
  }

  const payLinkStatus = (id: string) => $fetch<{ live: boolean, expiresAt: string | null }>(`/api/invoices/${id}/pay-link`)
  /** A new link for the customer (e-mailed again); the old one stops working. */
  const sendPayLink = (id: string) => $fetch<{ url: string, expiresAt: string, mailed: boolean }>(`/api/invoices/${id}/pay-link`, { method: 'POST' })
  const revokePayLink = (id: string) => $fetch<{ revoked: number }>(`/api/invoices/${id}/pay-link`, { method: 'DELETE' })

  return { forJob, byId, paying, create, setState, fetchOne, pay, takeAtCounter, payLinkStatus, sendPayLink, revokePayLink }
})
