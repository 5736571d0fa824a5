import { z } from 'zod'

/**
 * The environment the server reads, parsed once. Read lazily so that `next build` (which imports
 * route modules to collect them) does not need a database.
 */
const serverEnvSchema = z.object({
  DATABASE_URL: z.string().url().startsWith('postgres'),
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  /**
   * Whether the session cookie carries `Secure`. On by default outside development; the local demo
   * and the end-to-end tests serve plain http on loopback and switch it off there explicitly.
   */
  SESSION_COOKIE_SECURE: z.enum(['true', 'false']).optional(),
  /**
   * Read replicas of the database (PostgreSQL streaming replicas), comma-separated
   * `postgres://…` URLs. Unset: everything goes to DATABASE_URL. Set: still everything goes to the
   * primary (DATABASE_URL) but the reads that say they may be a moment stale (`STALE_READ` in
   * lib/db.ts), which are spread over these.
   */
  DATABASE_READ_URLS: z
    .string()
    .refine(
      (value) => value.split(',').every((part) => URL.canParse(part.trim()) && /^postgres(ql)?:$/.test(new URL(part.trim()).protocol)),
      'comma-separated postgres:// URLs',
    )
    .optional(),
  /** Log every SQL statement (for debugging). */
  DATABASE_LOG: z.enum(['true', 'false']).default('false'),
  /**
   * The address people open the app at, e.g. `https://wreathwright.example` or
   * `http://127.0.0.1:3000`: its origin (scheme, host, port) is the only one whose pages may send
   * state-changing requests. Required in production; elsewhere it defaults to
   * `http://127.0.0.1:$PORT` (3000), where `npm run dev` listens.
   */
  PUBLIC_URL: z
    .string()
    .refine((value) => URL.canParse(value) && /^https?:$/.test(new URL(value).protocol), 'an http(s) URL')
    .optional(),
  PORT: z.coerce.number().int().min(1).max(65_535).optional(),
  /**
   * Whether a reverse proxy in front of the app sets `X-Forwarded-Host` and `X-Forwarded-Proto`
   * (overwriting what clients send). Off by default: those headers are then ignored.
   */
  TRUST_PROXY: z.enum(['true', 'false']).default('false'),
  /**
   * The object store uploads (photos, swatches) are kept in: any S3-compatible service, reached
   * through the S3 SDK with path-style addresses. `npm run demo` and `npm test` start a local one on
   * loopback and set these; without S3_ENDPOINT and S3_BUCKET, uploads answer 503.
   */
  S3_ENDPOINT: z
    .string()
    .refine((value) => URL.canParse(value) && /^https?:$/.test(new URL(value).protocol), 'an http(s) URL')
    .optional(),
  S3_BUCKET: z.string().min(3).max(63).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  /** Put before every object key, e.g. `wreathwright/` when the bucket is shared with others. */
  S3_KEY_PREFIX: z.string().max(200).default(''),
  /**
   * The SMTP server messages are handed to (lib/mail/transport.ts). `npm run demo` and `npm test`
   * start a local mail catcher (maildev) on loopback and set these; without SMTP_PORT no message
   * leaves: they wait in the queue, none is lost.
   */
  SMTP_HOST: z.string().min(1).default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65_535).optional(),
  /** TLS from the first byte (port 465); otherwise STARTTLS is used when the server offers it. */
  SMTP_SECURE: z.enum(['true', 'false']).default('false'),
  SMTP_USER: z.string().min(1).optional(),
  SMTP_PASSWORD: z.string().min(1).optional(),
  /** The sender of every message: the product's name and an address, `Name <address>`. */
  MAIL_FROM: z
    .string()
    .regex(/^[^<>]+ <[^<>@\s]+@[^<>@\s]+>$/, 'Name <address>')
    .default('Wreathwright <mail@wreathwright.example>'),
  /** The mail catcher's web view, linked from the admin desk; unset where real mail goes out. */
  MAIL_VIEW_URL: z
    .string()
    .refine((value) => URL.canParse(value) && /^https?:$/.test(new URL(value).protocol), 'an http(s) URL')
    .optional(),
  /** `off` keeps this process from sending (another instance, or none, runs the mail worker). */
  MAIL_WORKER: z.enum(['on', 'off']).default('on'),
  /** Tries after the first failed one, each later than the last (pg-boss retryBackoff). */
  MAIL_RETRY_LIMIT: z.coerce.number().int().min(0).max(20).default(6),
  /** Wait before the first retry; it doubles for each next one (30 s, 1 min, 2 min, … ≈ 32 min). */
  MAIL_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).default(30),
  /** How often an idle worker looks for new messages (pg-boss's minimum is 0.5 s). */
  MAIL_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(2),
  /**
   * The payment provider's API, reached through its official SDK (lib/payments/provider.ts).
   * Unset, the SDK talks to the provider itself; `npm run demo` and `npm test` start a local fake
   * (scripts/payment-fake.ts) on loopback and point this at it. Without PAYMENTS_SECRET_KEY,
   * checkout answers 503; without PAYMENTS_WEBHOOK_SECRET, every webhook call is refused.
   */
  PAYMENTS_API_URL: z
    .string()
    .refine((value) => URL.canParse(value) && /^https?:$/.test(new URL(value).protocol), 'an http(s) URL')
    .optional(),
  PAYMENTS_SECRET_KEY: z.string().min(1).optional(),
  /** The secret the provider signs webhook events with (`whsec_…`). */
  PAYMENTS_WEBHOOK_SECRET: z.string().min(1).optional(),
  /** `off` keeps this process from processing payment events (another instance does). */
  PAYMENTS_WORKER: z.enum(['on', 'off']).default('on'),
  /** How often an idle payment worker looks for queued events (pg-boss's minimum is 0.5 s). */
  PAYMENTS_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(1),
  /**
   * The secret that signs buyers' short-lived booklet download links (HMAC-SHA-256), at least 32
   * characters. Unset, each app process makes a random one when it starts: links then work only
   * on the instance that made them, which is enough for one instance (the demo, the tests).
   */
  BOOKLET_LINK_SECRET: z.string().min(32).optional(),
  /** How long a booklet download link works, minutes. */
  BOOKLET_LINK_MINUTES: z.coerce.number().int().min(1).max(24 * 60).default(10),
  /** Booklets one booklet worker process (scripts/booklet-worker.ts) builds at once, each in its own thread. */
  BOOKLET_WORKER_CONCURRENCY: z.coerce.number().int().min(1).max(32).default(2),
  /** How often an idle booklet worker looks for queued builds (pg-boss's minimum is 0.5 s). */
  BOOKLET_POLL_SECONDS: z.coerce.number().min(0.5).max(60).default(1),
})

export type ServerEnv = z.infer<typeof serverEnvSchema>

let cached: ServerEnv | undefined

export function serverEnv(): ServerEnv {
  if (!cached) {
    const parsed = serverEnvSchema.safeParse(process.env)
    if (!parsed.success) {
      const fields = parsed.error.issues.map((issue) => issue.path.join('.')).join(', ')
      throw new Error(`The server environment is incomplete or wrong: ${fields}`)
    }
    cached = parsed.data
  }
  return cached
}

export function isSessionCookieSecure(env: ServerEnv = serverEnv()): boolean {
  if (env.SESSION_COOKIE_SECURE) return env.SESSION_COOKIE_SECURE === 'true'
  return env.NODE_ENV !== 'development'
}

/** Where the app's own origin comes from, and whether forwarded headers count. */
export interface OriginSettings {
  /** Origins (scheme://host:port, as `URL.origin` writes them) whose pages may change things. */
  readonly origins: readonly string[]
  readonly trustProxy: boolean
}

/**
 * The app's own origin from `PUBLIC_URL`. Without it, outside production, the loopback address
 * `npm run dev` serves (under both of its names); in production a missing `PUBLIC_URL` is an error.
 */
export function originSettings(env: ServerEnv = serverEnv()): OriginSettings {
  const trustProxy = env.TRUST_PROXY === 'true'
  if (env.PUBLIC_URL) return { origins: [new URL(env.PUBLIC_URL).origin], trustProxy }
  if (env.NODE_ENV === 'production') throw new Error('The server environment is incomplete or wrong: PUBLIC_URL')
  const port = env.PORT ?? 3000
  return { origins: [`http://127.0.0.1:${port}`, `http://localhost:${port}`], trustProxy }
}

/** Where uploads are stored; null when no object store is configured. */
export interface ObjectStoreSettings {
  readonly endpoint: string
  readonly bucket: string
  readonly region: string
  readonly credentials?: { readonly accessKeyId: string; readonly secretAccessKey: string }
  readonly keyPrefix: string
}

export function objectStoreSettings(env: ServerEnv = serverEnv()): ObjectStoreSettings | null {
  if (!env.S3_ENDPOINT || !env.S3_BUCKET) return null
  const credentials =
    env.S3_ACCESS_KEY_ID && env.S3_SECRET_ACCESS_KEY ? { accessKeyId: env.S3_ACCESS_KEY_ID, secretAccessKey: env.S3_SECRET_ACCESS_KEY } : undefined
  return { endpoint: env.S3_ENDPOINT, bucket: env.S3_BUCKET, region: env.S3_REGION, credentials, keyPrefix: env.S3_KEY_PREFIX }
}

/** How messages are sent (lib/mail/): the SMTP server, the sender and the queue's retry policy. */
export interface MailSettings {
  /** Null when SMTP_PORT is unset: messages are queued and wait. */
  readonly smtp: { readonly host: string; readonly port: number; readonly secure: boolean; readonly auth?: { readonly user: string; readonly pass: string } } | null
  readonly from: string
  /** The mail catcher's web view for the admin desk; null when unset. */
  readonly viewUrl: string | null
  readonly worker: boolean
  readonly retryLimit: number
  readonly retryDelaySeconds: number
  readonly pollSeconds: number
}

export function mailSettings(env: ServerEnv = serverEnv()): MailSettings {
  const auth = env.SMTP_USER && env.SMTP_PASSWORD ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD } : undefined
  return {
    smtp: env.SMTP_PORT ? { host: env.SMTP_HOST, port: env.SMTP_PORT, secure: env.SMTP_SECURE === 'true', ...(auth ? { auth } : {}) } : null,
    from: env.MAIL_FROM,
    viewUrl: env.MAIL_VIEW_URL ?? null,
    worker: env.MAIL_WORKER === 'on',
    retryLimit: env.MAIL_RETRY_LIMIT,
    retryDelaySeconds: env.MAIL_RETRY_DELAY_SECONDS,
    pollSeconds: env.MAIL_POLL_SECONDS,
  }
}

/** How the app reaches the payment provider (lib/payments/). */
export interface PaymentSettings {
  /** Null when PAYMENTS_SECRET_KEY is unset: checkout is closed. */
  readonly secretKey: string | null
  /** Null when unset: every webhook call is refused. */
  readonly webhookSecret: string | null
  /** The API's address when it is not the provider's own (the local fake); null otherwise. */
  readonly api: { readonly host: string; readonly port: number; readonly protocol: 'http' | 'https' } | null
  readonly worker: boolean
  readonly pollSeconds: number
}

export function paymentSettings(env: ServerEnv = serverEnv()): PaymentSettings {
  let api: PaymentSettings['api'] = null
  if (env.PAYMENTS_API_URL) {
    const url = new URL(env.PAYMENTS_API_URL)
    const protocol = url.protocol === 'https:' ? 'https' : 'http'
    api = { host: url.hostname, port: url.port ? Number(url.port) : protocol === 'https' ? 443 : 80, protocol }
  }
  return {
    secretKey: env.PAYMENTS_SECRET_KEY ?? null,
    webhookSecret: env.PAYMENTS_WEBHOOK_SECRET ?? null,
    api,
    worker: env.PAYMENTS_WORKER === 'on',
    pollSeconds: env.PAYMENTS_POLL_SECONDS,
  }
}

/** How buyers' booklets are built and handed out (lib/services/booklets.ts, scripts/booklet-worker.ts). */
export interface BookletSettings {
  /** Null when BOOKLET_LINK_SECRET is unset: the process makes its own (lib/booklets/download-token.ts). */
  readonly linkSecret: string | null
  readonly linkSeconds: number
  readonly workerConcurrency: number
  readonly pollSeconds: number
}

export function bookletSettings(env: ServerEnv = serverEnv()): BookletSettings {
  return {
    linkSecret: env.BOOKLET_LINK_SECRET ?? null,
    linkSeconds: env.BOOKLET_LINK_MINUTES * 60,
    workerConcurrency: env.BOOKLET_WORKER_CONCURRENCY,
    pollSeconds: env.BOOKLET_POLL_SECONDS,
  }
}
