import { BODY_LIMITS, route } from '@/lib/http'
import { withdrawInvitation } from '@/lib/services/invitations'
import { authorizePatternAction } from '@/lib/services/patterns'

/** Withdraws an invitation: its tester loses the pattern at once. Answers the invitation as it now stands. */
export const DELETE = route(
  {
    params: ['id', 'invitationId'],
    bodyLimit: BODY_LIMITS.none,
    session: 'required',
    permit: ({ user, params }) => authorizePatternAction(user, params.id, 'invite-testers'),
  },
  async ({ user, params }) => Response.json({ invitation: await withdrawInvitation(user, params.id, params.invitationId) }),
)
