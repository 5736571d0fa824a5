import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { pageQuerySchema } from '@/lib/schemas/admin'
import { listAuditEntries } from '@/lib/services/admin'
import { parseQuery } from '../query'

/** `GET /api/admin/audit?page=`: the admin audit log, newest first. */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-audit-log') },
  async ({ user, request }) => Response.json(await listAuditEntries(user, parseQuery(pageQuerySchema, request))),
)
