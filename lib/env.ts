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
