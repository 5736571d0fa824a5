import { BODY_LIMITS, route } from '@/lib/http'
import { updatePatternSchema } from '@/lib/schemas/pattern'
import { authorizePatternAction, deletePattern, readablePattern, toView, updatePattern } from '@/lib/services/patterns'

// The permission step loads and authorizes the pattern; the answer is made from that row, so a
// read loads the pattern (its design) and its testers once, not twice (seen in `npm run load`).
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => readablePattern(user, params.id) },
  async ({ resource }) => Response.json({ pattern: toView(resource.pattern) }),
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
