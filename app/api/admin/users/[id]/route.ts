import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { updateUserSchema } from '@/lib/schemas/admin'
import { updateUser } from '@/lib/services/admin'

/** `PATCH /api/admin/users/:id { roles?, disabled? }`: grant or revoke roles, disable or re-enable. */
export const PATCH = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.form, session: 'required', permit: ({ user }) => authorize(user, 'manage-users'), body: updateUserSchema },
  async ({ user, params, body }) => Response.json({ user: await updateUser(user, params.id, body) }),
)
