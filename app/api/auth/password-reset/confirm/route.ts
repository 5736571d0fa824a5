import { BODY_LIMITS, route } from '@/lib/http'
import { passwordResetConfirmSchema } from '@/lib/schemas/account'
import { confirmPasswordReset } from '@/lib/services/accounts'

/** A new password from a reset link; every session of the account ends (the person signs in again). */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: passwordResetConfirmSchema }, async ({ body }) =>
  Response.json(await confirmPasswordReset(body.token, body.password)),
)
