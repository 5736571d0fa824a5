import { BODY_LIMITS, route } from '@/lib/http'
import { verifyEmailSchema } from '@/lib/schemas/account'
import { confirmEmailChange } from '@/lib/services/account-settings'

/** The new address's link, posted by its page; no session needed (the link may open in another browser). */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: verifyEmailSchema }, async ({ body }) =>
  Response.json(await confirmEmailChange(body.token)),
)
