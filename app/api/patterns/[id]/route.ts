import { BODY_LIMITS, route } from '@/lib/http'
import { updatePatternSchema } from '@/lib/schemas/pattern'
import { authorizePatternAction, deletePattern, getPattern, updatePattern } from '@/lib/services/patterns'

export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'read-pattern') },
  async ({ user, params }) => Response.json({ pattern: await getPattern(user, params.id) }),
)

export const PATCH = route(
  {
    params: ['id'],
    bodyLimit: BODY_LIMITS.design,
    session: 'required',
    permit: ({ user, params }) => authorizePatternAction(user, params.id, 'update-pattern'),
    body: updatePatternSchema,
  },
  async ({ user, params, body }) => Response.json({ pattern: await updatePattern(user, params.id, body) }),
)

export const DELETE = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'delete-pattern') },
  async ({ user, params }) => {
    await deletePattern(user, params.id)
    return new Response(null, { status: 204 })
  },
)
