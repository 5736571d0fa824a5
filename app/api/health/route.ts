import { database } from '@/lib/db'

export const dynamic = 'force-dynamic'

/** Liveness and database check, for the start scripts and monitoring. */
export async function GET(): Promise<Response> {
  try {
    await database().query('SELECT 1')
    return Response.json({ status: 'ok', database: 'ok' })
  } catch {
    return Response.json({ status: 'degraded', database: 'unreachable' }, { status: 503 })
  }
}
