import { DATABASE_RETRY_AFTER_SECONDS } from '@/lib/database-unavailable'
import { database } from '@/lib/db'

export const dynamic = 'force-dynamic'

/** Liveness and database check, for the start scripts and monitoring. */
export async function GET(): Promise<Response> {
  try {
    await database().query('SELECT 1')
    return Response.json({ status: 'ok', database: 'ok' })
  } catch {
    // Like every route's answer while the database is away (lib/http.ts): come back in a few seconds.
    return Response.json({ status: 'degraded', database: 'unreachable' }, { status: 503, headers: { 'retry-after': String(DATABASE_RETRY_AFTER_SECONDS) } })
  }
}
