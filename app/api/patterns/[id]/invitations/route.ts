import { BODY_LIMITS, route } from '@/lib/http'
import { createInvitationSchema } from '@/lib/schemas/invitation'
import { inviteTester, listInvitations } from '@/lib/services/invitations'
import { authorizePatternAction } from '@/lib/services/patterns'

/** The pattern's tester invitations, for its designer. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizePatternAction(user, params.id, 'invite-testers') },
  async ({ user, params }) => Response.json({ invitations: await listInvitations(user, params.id) }),
)

/** Invites an e-mail address to test the pattern (201); the invitation e-mail is queued with it. */
export const POST = route(
  {
    params: ['id'],
    bodyLimit: BODY_LIMITS.form,
    session: 'required',
    permit: ({ user, params }) => authorizePatternAction(user, params.id, 'invite-testers'),
    body: createInvitationSchema,
  },
  async ({ user, params, body }) => Response.json({ invitation: await inviteTester(user, params.id, body) }, { status: 201 }),
)
