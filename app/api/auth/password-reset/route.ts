import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { passwordResetRequestSchema } from '@/lib/schemas/account'
import { requestPasswordReset } from '@/lib/services/accounts'

/** 202 with the same body whether or not the address has an account. */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: passwordResetRequestSchema }, async ({ request, body }) =>
  Response.json(await requestPasswordReset(body.email, { clientAddress: requestAddress(request) }), { status: 202 }),
)
