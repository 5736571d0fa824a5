import { BODY_LIMITS, route } from '@/lib/http'
import { verifyEmailSchema } from '@/lib/schemas/account'
import { verifyEmail } from '@/lib/services/accounts'

/** The link's token, posted by the verify-email page; no session needed (any browser may open the link). */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: verifyEmailSchema }, async ({ body }) =>
  Response.json(await verifyEmail(body.token)),
)
