import { describe, expect, it } from 'vitest'
import Stripe from 'stripe'
import { parseForm, signPayload } from '../../scripts/lib/payment-fake.mjs'

const stripe = new Stripe('sk_test_local_unit', { host: '127.0.0.1', port: 1, protocol: 'http' })
const secret = 'whsec_unit_test_secret'

describe('the payment fake', () => {
  it('signs events so the provider SDK verifies them', () => {
    const payload = JSON.stringify({ id: 'evt_1', object: 'event', type: 'payment_intent.succeeded', data: { object: { id: 'pi_1', amount: 2170 } } })
    const event = stripe.webhooks.constructEvent(payload, signPayload(payload, secret), secret)
    expect(event.id).toBe('evt_1')
    expect(event.type).toBe('payment_intent.succeeded')
  })

  it('is refused by the SDK with a wrong secret, a changed payload or an old timestamp', () => {
    const payload = JSON.stringify({ id: 'evt_2', object: 'event', type: 'payment_intent.succeeded', data: { object: {} } })
    expect(() => stripe.webhooks.constructEvent(payload, signPayload(payload, 'whsec_other'), secret)).toThrow()
    expect(() => stripe.webhooks.constructEvent(payload.replace('evt_2', 'evt_3'), signPayload(payload, secret), secret)).toThrow()
    const hourAgo = Math.floor(Date.now() / 1000) - 3600
    expect(() => stripe.webhooks.constructEvent(payload, signPayload(payload, secret, hourAgo), secret)).toThrow()
  })

  it('reads the API\'s form encoding, nested keys included', () => {
    expect(parseForm('amount=2170&currency=usd&metadata[invoiceId]=inv-1&metadata[shopId]=s-1')).toEqual({
      amount: '2170', currency: 'usd', metadata: { invoiceId: 'inv-1', shopId: 's-1' },
    })
  })
})
