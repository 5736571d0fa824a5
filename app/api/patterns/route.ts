import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { createPatternSchema } from '@/lib/schemas/pattern'
import { createPattern, listOwnPatterns } from '@/lib/services/patterns'

export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'list-own-patterns') },
  async ({ user }) => Response.json({ patterns: await listOwnPatterns(user) }),
)

export const POST = route(
  {
    bodyLimit: BODY_LIMITS.design,
    session: 'required',
    permit: ({ user }) => authorize(user, 'create-pattern'),
    body: createPatternSchema,
  },
  async ({ user, body }) => Response.json({ pattern: await createPattern(user, body) }, { status: 201 }),
)
