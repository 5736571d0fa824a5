import { BODY_LIMITS, route } from '@/lib/http'
import { bookletStatus } from '@/lib/services/booklets'

/**
 * `GET /api/booklets/:id` → `{ id, state: 'queued'|'building'|'ready'|'failed', progress?: { pages,
 * of }, url?, urlExpiresAt?, error? }`: the url a short-lived download link once ready. Only the
 * licence holder who asked for it; anyone else 404.
 */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => bookletStatus(user, params.id) },
  async ({ resource }) => Response.json(resource, { headers: { 'cache-control': 'no-store' } }),
)
