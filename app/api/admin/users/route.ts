import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { userListQuerySchema } from '@/lib/schemas/admin'
import { listUsers } from '@/lib/services/admin'
import { parseQuery } from '../query'

/** `GET /api/admin/users?q=&sort=&page=`: a page of the users table. */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'manage-users') },
  async ({ user, request }) => Response.json(await listUsers(user, parseQuery(userListQuerySchema, request))),
)
