import http from 'node:http'
import { afterAll, beforeAll } from 'vitest'
import Stripe from 'stripe'
import { database } from '@/lib/db'
import { paymentSettings } from '@/lib/env'
import { closeQueueSender } from '@/lib/jobs/boss'
import { startPaymentWorker, stopPaymentWorker } from '@/lib/jobs/worker'
import { POST as webhook } from '@/app/api/webhooks/payments/route'

/**
 * The payment fake (scripts/payment-fake.ts, started by scripts/run-tests.ts, PAYMENTS_API_URL)
 * seen from integration tests: its events are forwarded to the webhook route in this process, a
 * payment worker applies them here, and the tests read the fake back through the SDK as the app does.
 *
 *   usePaymentFake()                       // webhook forwarding and the worker, for the file
 *   await payOnHostedPage(url)             // the "Pay" button of the fake's page
 *   const raw = signed(event)              // { body, signature } as the provider would send it
 */

function fakeUrl(): string {
  const url = process.env.PAYMENTS_API_URL
  if (!url) throw new Error('PAYMENTS_API_URL is not set: run these tests through `npm test`')
  return url
}

/** The SDK, pointed at the fake with the app's own settings. */
export function provider(): Stripe {
  const settings = paymentSettings()
  return new Stripe(settings.secretKey!, { host: settings.api!.host, port: settings.api!.port, protocol: settings.api!.protocol, maxNetworkRetries: 0, telemetry: false })
}

/** A body and its signature header, signed by the SDK's helper with `secret` (the app's by default). */
export function signed(event: object, secret = paymentSettings().webhookSecret!): { body: string; signature: string } {
  const body = JSON.stringify(event)
  return { body, signature: provider().webhooks.generateTestHeaderString({ payload: body, secret }) }
}

/** Presses "Pay" on the fake's hosted page; answers where the buyer is sent back to. */
export async function payOnHostedPage(url: string): Promise<string> {
  const response = await fetch(`${url}/pay`, { method: 'POST', redirect: 'manual' })
  if (response.status !== 303) throw new Error(`the fake's Pay answered ${response.status}`)
  return response.headers.get('location')!
}

/** Asks the fake to send one of its events again (the provider may deliver an event twice). */
export async function resendEvent(eventId: string): Promise<void> {
  const response = await fetch(`${fakeUrl()}/_fake/events/${eventId}/resend`, { method: 'POST' })
  if (!response.ok) throw new Error(`the fake's resend answered ${response.status}`)
}

/** The events the fake sent, oldest first. */
export async function sentEvents(): Promise<{ event: { id: string; type: string; data: { object: Record<string, unknown> } }; delivered: boolean }[]> {
  const response = await fetch(`${fakeUrl()}/_fake/events`)
  return ((await response.json()) as { events: [] }).events
}

/** Waits until `check` passes (it throws until then), up to `timeoutMs`. */
export async function eventually<T>(check: () => Promise<T>, timeoutMs = 20_000): Promise<T> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    try {
      return await check()
    } catch (error) {
      if (Date.now() > deadline) throw error
      await new Promise((resolve) => setTimeout(resolve, 200))
    }
  }
}

/** Empties the payment tables and the payment queue (freshDatabase empties users and patterns). */
export async function clearPayments(): Promise<void> {
  await database().query('TRUNCATE payment_events, licences, orders RESTART IDENTITY CASCADE')
  await database().query(`DELETE FROM pgboss.job WHERE name = 'payment-events'`).catch(() => undefined)
}

/**
 * For the file's tests: a small HTTP server in this process hands the fake's webhook calls to the
 * route handler (as Next would), and a payment worker applies the events.
 */
export function usePaymentFake(): void {
  let server: http.Server | undefined
  beforeAll(async () => {
    server = http.createServer((incoming, outgoing) => {
      void (async () => {
        const chunks: Buffer[] = []
        for await (const chunk of incoming) chunks.push(chunk as Buffer)
        const headers = new Headers()
        for (const [name, value] of Object.entries(incoming.headers)) if (typeof value === 'string') headers.set(name, value)
        const response = await webhook(new Request(`http://127.0.0.1${incoming.url}`, { method: incoming.method, headers, body: Buffer.concat(chunks) }))
        outgoing.writeHead(response.status, { 'content-type': 'application/json' })
        outgoing.end(await response.text())
      })()
    })
    await new Promise<void>((resolve) => server!.listen(0, '127.0.0.1', resolve))
    const address = server.address() as { port: number }
    const answer = await fetch(`${fakeUrl()}/_fake/webhook-url`, {
      method: 'PUT',
      body: JSON.stringify({ url: `http://127.0.0.1:${address.port}/api/webhooks/payments` }),
    })
    if (!answer.ok) throw new Error('could not point the fake at this process')
    await startPaymentWorker({ pollSeconds: 0.5 })
  })
  afterAll(async () => {
    await stopPaymentWorker()
    await closeQueueSender()
    await new Promise((resolve) => server?.close(resolve))
  })
}
