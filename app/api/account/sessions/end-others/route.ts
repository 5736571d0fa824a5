import { BODY_LIMITS, route } from '@/lib/http'
import { endOtherSessions } from '@/lib/services/account-settings'

/** "Sign out everywhere else". */
export const POST = route({ bodyLimit: BODY_LIMITS.none, session: 'required' }, async ({ user, sessionId }) =>
  Response.json(await endOtherSessions(user, sessionId)),
)
