import { BODY_LIMITS, route } from '@/lib/http'
import { authorizePatternAction, listStateChanges } from '@/lib/services/patterns'

/** The pattern's history of states (from, to, who, when), oldest first, for its designer. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'update-pattern') },
  async ({ user, params }) => Response.json({ stateChanges: await listStateChanges(user, params.id) }),
)
