import Stripe from 'stripe'

let instance: Stripe | undefined

/** The provider's SDK client; host and port point it at the local fake outside production. */
export function usePayments(): Stripe {
  if (!instance) {
    const config = useRuntimeConfig()
    if (!config.paymentSecretKey) throw createError({ statusCode: 503, message: 'Payments are not configured on this server.' })
    instance = new Stripe(config.paymentSecretKey, {
      host: config.paymentApiHost,
      port: Number(config.paymentApiPort) || undefined,
      protocol: config.paymentApiProtocol === 'https' ? 'https' : 'http',
      maxNetworkRetries: 1,
      timeout: 10_000,
      telemetry: false,
    })
  }
  return instance
}

/** The card the server confirms with, standing in for the card form the customer would fill in. */
export const TEST_PAYMENT_METHOD = 'pm_card_visa'
