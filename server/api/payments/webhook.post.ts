import type Stripe from 'stripe'
import { handlePaymentEvent } from '../../utils/payment-events'

export default defineEventHandler(async (event) => {
  const signature = getHeader(event, 'stripe-signature')
  const raw = await readRawBody(event, false)
  if (!signature || !raw) throw createError({ statusCode: 400, message: 'Missing signature or body.' })
  let verified: Stripe.Event
  try {
    verified = usePayments().webhooks.constructEvent(raw, signature, useRuntimeConfig().paymentWebhookSecret)
  }
  catch {
    throw createError({ statusCode: 400, message: 'The signature does not match.' })
  }
  const outcome = await handlePaymentEvent(verified)
  return { received: true, duplicate: outcome === 'duplicate' }
})
