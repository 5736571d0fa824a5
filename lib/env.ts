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
