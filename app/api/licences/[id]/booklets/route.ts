import { BODY_LIMITS, route } from '@/lib/http'
import { bookletRequestSchema } from '@/lib/schemas/booklet-builds'
import { licenceForBooklet, requestBooklet } from '@/lib/services/booklets'

/**
 * `POST /api/licences/:id/booklets { paper, orientation?, colorway?, diameterIn? }` → `{ id, state,
 * progress?, url? }`: the licence holder asks for their booklet, built by the booklet worker (202
 * while it waits or builds; 200 when the same booklet is already stored). Anyone else: 404.
 */
export const POST = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user, params }) => licenceForBooklet(user, params.id), body: bookletRequestSchema },
  async ({ user, resource, body }) => {
    const status = await requestBooklet(user, resource, body)
    return Response.json(status, { status: status.state === 'ready' ? 200 : 202 })
  },
)
