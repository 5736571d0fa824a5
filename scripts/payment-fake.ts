/**
 * The local payment provider the demo and the tests start: our own small HTTP server on loopback
 * that answers the few calls of the provider's API the app makes through the official SDK
 * (`stripe` from npm), and nothing else:
 *   POST /v1/checkout/sessions        a checkout session, form-encoded as the SDK sends it
 *   GET  /v1/checkout/sessions/:id    that session again
 *   POST /v1/refunds                  a full or partial refund of a payment intent
 * and the session's hosted page (`GET /pay/:id`) with a "Pay" and a "Cancel" button. Paying marks
 * the session paid and sends `checkout.session.completed` to the webhook address; a refund sends
 * `charge.refunded` (the two event types the provider names for these, from the SDK's
 * `Stripe.Event.Type`). Each event is signed with the provider's scheme by the SDK's own helper
 * (`stripe.webhooks.generateTestHeaderString`), and sent again, later each time, until the
 * webhook answers 2xx or the tries run out.
 *
 * Its own controls, not the provider's, live under /_fake/: where webhooks go, the events sent and
 * how their deliveries went, and sending one again (the provider may deliver an event twice).
 * State is in memory: a restart forgets every session.
 */
import { randomBytes } from 'node:crypto'
import http from 'node:http'
import Stripe from 'stripe'

/** The keys the demo and the tests use; they only have to agree between the fake and the app. */
export const FAKE_SECRET_KEY = 'sk_test_wreathwright_local'
export const FAKE_WEBHOOK_SECRET = 'whsec_wreathwright_local'

export interface PaymentFakeOptions {
  port: number
  /** Where events are sent (the app's `POST /api/webhooks/payments`); may be set later. */
  webhookUrl?: string | null
  /** Delays between tries of a failed delivery, in ms (the provider's are hours; ours are short). */
  retryDelaysMs?: readonly number[]
}

export interface PaymentFake {
  readonly url: string
  readonly port: number
  /** The app's settings for this fake (lib/env.ts). */
  readonly env: Record<string, string>
  setWebhookUrl(url: string | null): void
  stop(): Promise<void>
}

interface Delivery {
  at: string
  status: number | null
  error?: string
}

interface SentEvent {
  event: Record<string, unknown>
  deliveries: Delivery[]
  delivered: boolean
}

interface Session {
  id: string
  object: 'checkout.session'
  amount_total: number
  amount_subtotal: number
  currency: string
  mode: string
  status: 'open' | 'complete' | 'expired'
  payment_status: 'unpaid' | 'paid'
  payment_intent: string | null
  success_url: string
  cancel_url: string
  url: string
  client_reference_id: string | null
  customer_email: string | null
  metadata: Record<string, string>
  created: number
  livemode: false
  /** Ours: the line items as they were asked for, for the hosted page (the provider lists them at /line_items). */
  line_items_requested: LineItem[]
}

interface LineItem {
  name: string
  unitAmount: number
  quantity: number
  currency: string
}

interface Charge {
  id: string
  object: 'charge'
  amount: number
  amount_refunded: number
  currency: string
  payment_intent: string
  refunded: boolean
  paid: true
  status: 'succeeded'
  metadata: Record<string, string>
  created: number
  livemode: false
}

/** A provider-looking id: prefix, underscore, 24 random letters and digits. */
function newId(prefix: string): string {
  return `${prefix}_${randomBytes(18).toString('base64url').replace(/[-_]/g, '').slice(0, 24)}`
}

const now = () => Math.floor(Date.now() / 1000)

/**
 * Reads a form body the way the SDK writes nested parameters (`a[b][0][c]=1`) into objects, with
 * numeric keys collected into arrays.
 *
 * @example parseForm('line_items[0][quantity]=1&mode=payment') // { line_items: [{ quantity: '1' }], mode: 'payment' }
 */
export function parseForm(body: string): Record<string, unknown> {
  const root: Record<string, unknown> = {}
  for (const [key, value] of new URLSearchParams(body)) {
    const parts = key.split(/\[|\]\[|\]/).filter((part) => part !== '')
    let node: Record<string, unknown> = root
    parts.forEach((part, index) => {
      if (index === parts.length - 1) {
        node[part] = value
        return
      }
      node[part] ??= {}
      node = node[part] as Record<string, unknown>
    })
  }
  return toArrays(root) as Record<string, unknown>
}

function toArrays(value: unknown): unknown {
  if (typeof value !== 'object' || value === null) return value
  const entries = Object.entries(value).map(([key, inner]) => [key, toArrays(inner)] as const)
  if (entries.length > 0 && entries.every(([key]) => /^\d+$/.test(key))) {
    return entries.sort(([a], [b]) => Number(a) - Number(b)).map(([, inner]) => inner)
  }
  return Object.fromEntries(entries)
}

class ProviderError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
  ) {
    super(message)
  }
}

function asRecord(value: unknown): Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>) : {}
}

function stringRecord(value: unknown): Record<string, string> {
  return Object.fromEntries(Object.entries(asRecord(value)).filter((entry): entry is [string, string] => typeof entry[1] === 'string'))
}

function integerParam(value: unknown, param: string): number {
  if (typeof value !== 'string' || !/^\d+$/.test(value)) throw new ProviderError(400, `Invalid integer: ${String(value)}`, param)
  return Number(value)
}

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (character) => `&#${character.charCodeAt(0)};`)
}

function formatAmount(cents: number, currency: string): string {
  return new Intl.NumberFormat('en', { style: 'currency', currency: currency.toUpperCase() }).format(cents / 100)
}

/** Starts the fake on 127.0.0.1:`port` (0 for any free port). */
export async function startPaymentFake(options: PaymentFakeOptions): Promise<PaymentFake> {
  const signer = new Stripe(FAKE_SECRET_KEY, { telemetry: false })
  const retryDelaysMs = options.retryDelaysMs ?? [250, 500, 1000, 2000, 4000, 8000]
  let webhookUrl = options.webhookUrl ?? null
  let stopped = false
  const sessions = new Map<string, Session>()
  const charges = new Map<string, Charge>()
  /** Payment intent id → its charge. */
  const chargeOfIntent = new Map<string, string>()
  const events: SentEvent[] = []
  /** Checkout session id → the metadata its payment intent (and so its charge) gets. */
  const pendingIntentMetadata = new Map<string, Record<string, string>>()
  const timers = new Set<NodeJS.Timeout>()
  let baseUrl = ''

  async function deliver(sent: SentEvent, attempt: number): Promise<void> {
    if (stopped || sent.delivered) return
    if (!webhookUrl) {
      sent.deliveries.push({ at: new Date().toISOString(), status: null, error: 'no webhook address set' })
    } else {
      const payload = JSON.stringify(sent.event)
      const signature = signer.webhooks.generateTestHeaderString({ payload, secret: FAKE_WEBHOOK_SECRET })
      try {
        const response = await fetch(webhookUrl, {
          method: 'POST',
          headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signature, 'user-agent': 'wreathwright-payment-fake' },
          body: payload,
          signal: AbortSignal.timeout(10_000),
        })
        await response.arrayBuffer().catch(() => undefined)
        sent.deliveries.push({ at: new Date().toISOString(), status: response.status })
        if (response.ok) {
          sent.delivered = true
          return
        }
      } catch (error) {
        sent.deliveries.push({ at: new Date().toISOString(), status: null, error: (error as Error).message })
      }
    }
    const delay = retryDelaysMs[attempt]
    if (delay === undefined) return
    const timer = setTimeout(() => {
      timers.delete(timer)
      void deliver(sent, attempt + 1)
    }, delay)
    timers.add(timer)
  }

  function sendEvent(type: string, object: unknown): SentEvent {
    const event = {
      id: newId('evt'),
      object: 'event',
      api_version: '2025-01-27.acacia',
      created: now(),
      type,
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      data: { object: structuredClone(object) },
    }
    const sent: SentEvent = { event, deliveries: [], delivered: false }
    events.push(sent)
    void deliver(sent, 0)
    return sent
  }

  function publicSession(session: Session): Omit<Session, 'line_items_requested'> {
    const { line_items_requested: _omitted, ...rest } = session
    return rest
  }

  function createSession(params: Record<string, unknown>): Session {
    if (params.mode !== 'payment') throw new ProviderError(400, 'Only mode=payment is supported by this fake.', 'mode')
    for (const param of ['success_url', 'cancel_url'] as const) {
      if (typeof params[param] !== 'string' || !URL.canParse(params[param])) throw new ProviderError(400, `Invalid URL: ${param}`, param)
    }
    const requested = Array.isArray(params.line_items) ? params.line_items : []
    if (requested.length === 0) throw new ProviderError(400, 'Missing required param: line_items.', 'line_items')
    const lineItems = requested.map((item, index): LineItem => {
      const line = asRecord(item)
      const price = asRecord(line.price_data)
      const product = asRecord(price.product_data)
      const currency = typeof price.currency === 'string' ? price.currency.toLowerCase() : ''
      if (!/^[a-z]{3}$/.test(currency)) throw new ProviderError(400, 'Invalid currency.', `line_items[${index}][price_data][currency]`)
      if (typeof product.name !== 'string' || !product.name) throw new ProviderError(400, 'Missing product name.', `line_items[${index}][price_data][product_data][name]`)
      return {
        name: product.name,
        currency,
        unitAmount: integerParam(price.unit_amount, `line_items[${index}][price_data][unit_amount]`),
        quantity: integerParam(line.quantity ?? '1', `line_items[${index}][quantity]`),
      }
    })
    const currency = lineItems[0]!.currency
    if (lineItems.some((line) => line.currency !== currency)) throw new ProviderError(400, 'All line items must share one currency.', 'line_items')
    const total = lineItems.reduce((sum, line) => sum + line.unitAmount * line.quantity, 0)
    const id = newId('cs_test')
    const session: Session = {
      id,
      object: 'checkout.session',
      amount_total: total,
      amount_subtotal: total,
      currency,
      mode: 'payment',
      status: 'open',
      payment_status: 'unpaid',
      payment_intent: null,
      success_url: params.success_url as string,
      cancel_url: params.cancel_url as string,
      url: `${baseUrl}/pay/${id}`,
      client_reference_id: typeof params.client_reference_id === 'string' ? params.client_reference_id : null,
      customer_email: typeof params.customer_email === 'string' ? params.customer_email : null,
      metadata: stringRecord(params.metadata),
      created: now(),
      livemode: false,
      line_items_requested: lineItems,
    }
    sessions.set(id, session)
    // The payment intent's metadata, for the charge made when the session is paid.
    pendingIntentMetadata.set(id, stringRecord(asRecord(params.payment_intent_data).metadata))
    return session
  }
  function pay(session: Session): void {
    if (session.status !== 'open') return
    const intent = newId('pi')
    const charge: Charge = {
      id: newId('ch'),
      object: 'charge',
      amount: session.amount_total,
      amount_refunded: 0,
      currency: session.currency,
      payment_intent: intent,
      refunded: false,
      paid: true,
      status: 'succeeded',
      metadata: pendingIntentMetadata.get(session.id) ?? {},
      created: now(),
      livemode: false,
    }
    charges.set(charge.id, charge)
    chargeOfIntent.set(intent, charge.id)
    Object.assign(session, { status: 'complete', payment_status: 'paid', payment_intent: intent })
    sendEvent('checkout.session.completed', publicSession(session))
  }

  function refund(params: Record<string, unknown>) {
    const intent = typeof params.payment_intent === 'string' ? params.payment_intent : null
    const chargeId = typeof params.charge === 'string' ? params.charge : intent ? chargeOfIntent.get(intent) : undefined
    const charge = chargeId ? charges.get(chargeId) : undefined
    if (!charge) throw new ProviderError(404, `No such payment_intent: '${intent ?? String(params.charge)}'`, intent ? 'payment_intent' : 'charge')
    const left = charge.amount - charge.amount_refunded
    const amount = params.amount === undefined ? left : integerParam(params.amount, 'amount')
    if (left === 0) throw new ProviderError(400, `Charge ${charge.id} has already been refunded.`)
    if (amount <= 0 || amount > left) throw new ProviderError(400, `Refund amount (${amount}) is greater than unrefunded amount on charge (${left})`, 'amount')
    charge.amount_refunded += amount
    charge.refunded = charge.amount_refunded === charge.amount
    const created = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: charge.id,
      currency: charge.currency,
      payment_intent: charge.payment_intent,
      status: 'succeeded',
      metadata: stringRecord(params.metadata),
      created: now(),
    }
    sendEvent('charge.refunded', charge)
    return created
  }

  function hostedPage(session: Session): string {
    const lines = session.line_items_requested
      .map((line) => `<li>${escapeHtml(line.name)}${line.quantity > 1 ? ` × ${line.quantity}` : ''}: ${escapeHtml(formatAmount(line.unitAmount * line.quantity, line.currency))}</li>`)
      .join('')
    const state =
      session.status === 'open'
        ? `<form method="post" action="/pay/${session.id}/pay"><button type="submit">Pay ${escapeHtml(formatAmount(session.amount_total, session.currency))}</button></form>
<form method="post" action="/pay/${session.id}/cancel"><button type="submit">Cancel</button></form>`
        : `<p>This checkout is ${session.status === 'complete' ? 'paid' : session.status}.</p>`
    return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Test payment</title>
<style>body{font-family:sans-serif;max-width:32rem;margin:3rem auto;color:#222}form{display:inline-block;margin-right:1rem}button{font-size:1rem;padding:.5rem 1.2rem}</style></head>
<body><p><strong>Test payment page</strong> (local payment fake: no money moves)</p><ul>${lines}</ul>
<p>Total: <strong data-testid="total">${escapeHtml(formatAmount(session.amount_total, session.currency))}</strong></p>${state}</body></html>`
  }

  async function readBody(request: http.IncomingMessage): Promise<string> {
    const chunks: Buffer[] = []
    let size = 0
    for await (const chunk of request) {
      size += (chunk as Buffer).length
      if (size > 256 * 1024) throw new ProviderError(413, 'Request too large.')
      chunks.push(chunk as Buffer)
    }
    return Buffer.concat(chunks).toString('utf8')
  }

  function sendJson(response: http.ServerResponse, status: number, body: unknown): void {
    response.writeHead(status, { 'content-type': 'application/json', 'request-id': newId('req') })
    response.end(JSON.stringify(body))
  }

  async function handle(request: http.IncomingMessage, response: http.ServerResponse): Promise<void> {
    const url = new URL(request.url ?? '/', baseUrl)
    const method = request.method ?? 'GET'
    const path = url.pathname
    if (path.startsWith('/v1/')) {
      if (request.headers.authorization !== `Bearer ${FAKE_SECRET_KEY}`) {
        throw new ProviderError(401, 'Invalid API Key provided.')
      }
      const params = method === 'POST' ? parseForm(await readBody(request)) : {}
      if (method === 'POST' && path === '/v1/checkout/sessions') return sendJson(response, 200, publicSession(createSession(params)))
      const retrieve = /^\/v1\/checkout\/sessions\/([\w]+)$/.exec(path)
      if (method === 'GET' && retrieve) {
        const session = sessions.get(retrieve[1]!)
        if (!session) throw new ProviderError(404, `No such checkout.session: '${retrieve[1]}'`, 'session')
        return sendJson(response, 200, publicSession(session))
      }
      if (method === 'POST' && path === '/v1/refunds') return sendJson(response, 200, refund(params))
      throw new ProviderError(404, `Unrecognized request URL (${method}: ${path}).`)
    }
    const page = /^\/pay\/([\w]+)(?:\/(pay|cancel))?$/.exec(path)
    if (page) {
      const session = sessions.get(page[1]!)
      if (!session) {
        response.writeHead(404, { 'content-type': 'text/plain' })
        return void response.end('No such checkout.')
      }
      if (method === 'GET' && !page[2]) {
        response.writeHead(200, { 'content-type': 'text/html; charset=utf-8' })
        return void response.end(hostedPage(session))
      }
      if (method === 'POST' && page[2] === 'pay') {
        pay(session)
        response.writeHead(303, { location: session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id) })
        return void response.end()
      }
      if (method === 'POST' && page[2] === 'cancel') {
        response.writeHead(303, { location: session.cancel_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id) })
        return void response.end()
      }
    }
    if (path === '/_fake/webhook-url' && method === 'PUT') {
      const body = JSON.parse((await readBody(request)) || '{}') as { url?: string | null }
      webhookUrl = body.url ?? null
      return sendJson(response, 200, { url: webhookUrl })
    }
    if (path === '/_fake/events' && method === 'GET') return sendJson(response, 200, { events })
    const resend = /^\/_fake\/events\/([\w]+)\/resend$/.exec(path)
    if (resend && method === 'POST') {
      const sent = events.find((candidate) => candidate.event.id === resend[1])
      if (!sent) throw new ProviderError(404, 'No such event.')
      sent.delivered = false
      await deliver(sent, retryDelaysMs.length)
      return sendJson(response, 200, sent)
    }
    if (path === '/' && method === 'GET') return sendJson(response, 200, { fake: 'payments', sessions: sessions.size, events: events.length })
    throw new ProviderError(404, `Unrecognized request URL (${method}: ${path}).`)
  }

  const server = http.createServer((request, response) => {
    handle(request, response).catch((error: unknown) => {
      const status = error instanceof ProviderError ? error.status : 500
      const message = error instanceof Error ? error.message : String(error)
      const param = error instanceof ProviderError ? error.param : undefined
      if (!response.headersSent) sendJson(response, status, { error: { type: status === 401 ? 'authentication_error' : 'invalid_request_error', message, ...(param ? { param } : {}) } })
      else response.end()
    })
  })
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject)
    server.listen(options.port, '127.0.0.1', () => resolve())
  })
  const address = server.address()
  const port = typeof address === 'object' && address ? address.port : options.port
  baseUrl = `http://127.0.0.1:${port}`
  return {
    url: baseUrl,
    port,
    env: { PAYMENTS_API_URL: baseUrl, PAYMENTS_SECRET_KEY: FAKE_SECRET_KEY, PAYMENTS_WEBHOOK_SECRET: FAKE_WEBHOOK_SECRET },
    setWebhookUrl: (url) => void (webhookUrl = url),
    stop: () =>
      new Promise<void>((resolve) => {
        stopped = true
        for (const timer of timers) clearTimeout(timer)
        server.closeAllConnections()
        server.close(() => resolve())
      }),
  }
}
