import { BODY_LIMITS, route } from '@/lib/http'
import { authorizePatternAction, listRevisions } from '@/lib/services/patterns'

export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'read-pattern') },
  async ({ user, params }) => Response.json({ revisions: await listRevisions(user, params.id) }),
)
