import { authorize } from '@/lib/authorization'
import { BODY_LIMITS, route } from '@/lib/http'
import { listLibrary } from '@/lib/services/licences'

/** `GET /api/library` → `{ licences: [ { id, number, patternId, patternName, designer, grantedAt, patternState } ] }`: the buyer's live licences. */
export const GET = route(
  { bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user }) => authorize(user, 'read-own-library') },
  async ({ user }) => Response.json({ licences: await listLibrary(user) }),
)
