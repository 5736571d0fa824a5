import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { pageQuerySchema } from '@/lib/schemas/admin'
import { listDesignerRequests } from '@/lib/services/admin'
import { parseQuery } from '../query'

/** `GET /api/admin/designer-requests?page=`: accounts waiting for a decision, oldest first. */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'decide-designer-requests') },
  async ({ user, request }) => Response.json(await listDesignerRequests(user, parseQuery(pageQuerySchema, request))),
)
