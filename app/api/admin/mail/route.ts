import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { pageQuerySchema } from '@/lib/schemas/admin'
import { listOutgoingMail } from '@/lib/services/admin'
import { parseQuery } from '../query'

/** `GET /api/admin/mail?page=`: the outgoing mail log (to, kind, state, times; never the messages). */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-mail-log') },
  async ({ user, request }) => Response.json(await listOutgoingMail(user, parseQuery(pageQuerySchema, request))),
)
