import { BODY_LIMITS, route } from '@/lib/http'
import { resendVerification } from '@/lib/services/accounts'

/** "Send it again": a new verification link to the signed-in person's address (rate limited). */
export const POST = route({ bodyLimit: BODY_LIMITS.none, session: 'required' }, async ({ user }) =>
  Response.json(await resendVerification(user), { status: 202 }),
)
