// The invoice behind an e-mailed pay link: no account, no device storage, only the token.
import type { InvoiceRecord } from '#shared/types/records'

type PaidInvoiceFields = 'number' | 'lines' | 'partsCents' | 'labourCents' | 'subtotalCents' | 'taxRateBasisPoints' | 'taxCents' | 'totalCents' | 'currency' | 'issuedAt' | 'paidAt' | 'paidWith'

/** What the pay route answers: the shop's contact and the invoice (never a draft). */
export interface PayLinkInvoice {
  shop: { name: string, address: string, phone: string, email: string }
  invoice: Pick<InvoiceRecord, PaidInvoiceFields> & { state: Exclude<InvoiceRecord['state'], 'draft'> }
  paymentPending: boolean
  expiresAt: string
}

const POLL_MS = 1500
const POLL_LIMIT = 80

export function usePayLink(token: string) {
  const data = ref<PayLinkInvoice | null>(null)
  const loading = ref(true)
  /** 'gone': the link is wrong, expired or stopped; 'offline': no answer at all. */
  const failure = ref<'gone' | 'offline' | null>(null)
  const { busy, problem, act } = useAction()
  const url = `/api/pay/${encodeURIComponent(token)}`

  async function load() {
    try {
      data.value = await $fetch<PayLinkInvoice>(url)
      failure.value = null
    }
    catch (e) {
      failure.value = statusOf(e) === undefined ? 'offline' : 'gone'
    }
    finally {
      loading.value = false
    }
  }

  /** The provider confirms the payment; the shop's server marks it paid when the provider tells it. */
  async function pay() {
    const ok = await act(() => $fetch(`${url}/pay`, { method: 'POST' }))
    if (!ok) return
    if (data.value) data.value.paymentPending = true
    for (let i = 0; i < POLL_LIMIT && data.value?.invoice.state !== 'paid'; i++) {
      await new Promise(r => setTimeout(r, POLL_MS))
      await load()
    }
  }

  return { data, loading, failure, busy, problem, load, pay }
}
