export const dynamic = 'force-dynamic'

const ANSWER = { status: 'ok' } as const

/**
 * A constant answer that touches no database, session or body: the baseline `npm run load`
 * (scripts/load.ts) measures every other route against, so its figures show what a route costs
 * beyond the framework's own work per request (the proxy, routing, JSON). `/api/health` is not
 * that baseline: it asks PostgreSQL `SELECT 1` on every call.
 */
export function GET(): Response {
  return Response.json(ANSWER)
}
