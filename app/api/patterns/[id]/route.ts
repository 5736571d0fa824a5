import { BODY_LIMITS, route } from '@/lib/http'
import { keptJsonResponse } from '@/lib/kept-json'
import { updatePatternSchema } from '@/lib/schemas/pattern'
import { authorizePatternAction, deletePattern, patternAnswer, updatePattern } from '@/lib/services/patterns'

// The permission step reads and authorizes the pattern's answer (kept by this process while it is
// unchanged: lib/row-changes.ts), so a read asks for the pattern once, or not at all.
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => patternAnswer(user, params.id) },
  async ({ request, resource }) => keptJsonResponse(request, resource),
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
