import 'server-only'
import Stripe from 'stripe'
import { paymentSettings } from '@/lib/env'
import { ServiceError } from '@/lib/errors'

/**
 * The payment provider, through its official SDK. Where PAYMENTS_API_URL is set (the demo and the
 * tests: the local fake, scripts/payment-fake.ts) the SDK is pointed at it; otherwise it talks to
 * the provider itself. No retries by the SDK: a checkout the provider did not answer is refused
 * and the buyer tries again. Kept on globalThis: Next bundles server code more than once.
 */
const globalForProvider = globalThis as typeof globalThis & { wreathwrightPayments?: { key: string; client: Stripe } }

export function paymentProvider(): Stripe {
  const settings = paymentSettings()
  if (!settings.secretKey) throw new ServiceError('Payments are not set up here (PAYMENTS_SECRET_KEY).', 503)
  const key = `${settings.secretKey}@${settings.api ? `${settings.api.protocol}://${settings.api.host}:${settings.api.port}` : 'provider'}`
  if (globalForProvider.wreathwrightPayments?.key !== key) {
    const client = new Stripe(settings.secretKey, {
      ...(settings.api ? { host: settings.api.host, port: settings.api.port, protocol: settings.api.protocol } : {}),
      maxNetworkRetries: 0,
      telemetry: false,
      timeout: 20_000,
    })
    globalForProvider.wreathwrightPayments = { key, client }
  }
  return globalForProvider.wreathwrightPayments.client
}
