// A local stand-in for the payment provider: just the PaymentIntent calls the app makes, in
// memory, and on confirm a signed `payment_intent.succeeded` event POSTed to the app's webhook.
import { createServer } from 'node:http'
import { createHmac, randomBytes } from 'node:crypto'

const rid = prefix => `${prefix}_${randomBytes(12).toString('hex')}`

/** `a=1&metadata[invoiceId]=x` -> { a: '1', metadata: { invoiceId: 'x' } } (the API's form encoding). */
export function parseForm(body) {
  const out = {}
  for (const [key, value] of new URLSearchParams(body)) {
    const path = key.split(/\[|\]\[|\]/).filter(Boolean)
    let node = out
    path.forEach((p, i) => {
      if (i === path.length - 1) node[p] = value
      else node = node[p] ??= {}
    })
  }
  return out
}

/** The provider's signature header: t=<ts>,v1=<hex HMAC-SHA256 of "<ts>.<payload>">. */
export function signPayload(payload, secret, timestamp = Math.floor(Date.now() / 1000)) {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex')
  return `t=${timestamp},v1=${v1}`
}

export function startPaymentFake({ port = 0, secretKey, webhookSecret, webhookUrl, log = () => {} }) {
  const intents = new Map()
  /** Every delivery made, so tests can replay one exactly. */
  const deliveries = []
  let target = webhookUrl

  const send = (res, status, body) => {
    res.writeHead(status, { 'content-type': 'application/json' })
    res.end(JSON.stringify(body))
  }
  const error = (res, status, message, type = 'invalid_request_error') => send(res, status, { error: { type, message } })

  async function deliver(intent) {
    const event = {
      id: rid('evt'), object: 'event', api_version: null, created: Math.floor(Date.now() / 1000), livemode: false,
      pending_webhooks: 1, request: { id: null, idempotency_key: null }, type: 'payment_intent.succeeded', data: { object: intent },
    }
    const payload = JSON.stringify(event)
    const signature = signPayload(payload, webhookSecret)
    deliveries.push({ eventId: event.id, payload, signature })
    if (!target) return
    try {
      const r = await fetch(target, { method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': signature }, body: payload })
      log(`webhook ${event.type} -> ${r.status}`)
    }
    catch (e) {
      log(`webhook not delivered: ${e.message}`)
    }
  }

  const server = createServer((req, res) => {
    const chunks = []
    req.on('data', c => chunks.push(c))
    req.on('end', () => {
      const url = new URL(req.url ?? '/', 'http://localhost')
      if (req.headers.authorization !== `Bearer ${secretKey}`) return error(res, 401, 'Invalid API key provided.', 'authentication_error')
      if (req.method === 'GET' && url.pathname === '/_fake/deliveries') return send(res, 200, { deliveries })
      const body = parseForm(Buffer.concat(chunks).toString('utf8'))
      const m = url.pathname.match(/^\/v1\/payment_intents(?:\/([^/]+))?(?:\/(confirm))?$/)
      if (!m) return error(res, 404, `Unrecognized request URL (${req.method}: ${url.pathname}).`)
      const [, id, action] = m
      if (req.method === 'POST' && !id) {
        const amount = Number(body.amount)
        if (!Number.isInteger(amount) || amount < 1) return error(res, 400, 'amount: must be a positive whole number of the smallest currency unit')
        if (!/^[a-z]{3}$/.test(body.currency ?? '')) return error(res, 400, 'currency: must be a three-letter code')
        const intent = {
          id: rid('pi'), object: 'payment_intent', amount, amount_received: 0, currency: body.currency, metadata: body.metadata ?? {},
          status: body.payment_method ? 'requires_confirmation' : 'requires_payment_method', payment_method: body.payment_method ?? null,
          created: Math.floor(Date.now() / 1000), livemode: false,
        }
        intent.client_secret = `${intent.id}_secret_${randomBytes(8).toString('hex')}`
        intents.set(intent.id, intent)
        return send(res, 200, intent)
      }
      const intent = id ? intents.get(id) : undefined
      if (!intent) return error(res, 404, `No such payment_intent: '${id}'`)
      if (req.method === 'GET' && !action) return send(res, 200, intent)
      if (req.method === 'POST' && action === 'confirm') {
        if (intent.status === 'succeeded') return error(res, 400, 'This PaymentIntent has already succeeded.')
        const pm = body.payment_method ?? intent.payment_method
        if (!pm) return error(res, 400, 'You must provide a payment method to confirm.')
        Object.assign(intent, { status: 'succeeded', payment_method: pm, amount_received: intent.amount })
        send(res, 200, intent)
        // Like the provider: the event follows the answer, not inside it.
        setImmediate(() => deliver({ ...intent }))
        return
      }
      return error(res, 404, `Unrecognized request URL (${req.method}: ${url.pathname}).`)
    })
  })
  return new Promise((resolve, reject) => {
    server.once('error', reject)
    server.listen(port, '127.0.0.1', () => {
      const address = server.address()
      resolve({
        port: address.port,
        // Keep-alive sockets too, so a closed fake is really gone (a test stops it mid-run).
        close: (cb) => {
          server.close(cb)
          server.closeAllConnections()
        },
        setWebhookUrl: (url) => { target = url },
        deliveries,
      })
    })
  })
}
