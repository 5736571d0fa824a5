import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { passwordChangeSchema } from '@/lib/schemas/account'
import { changePassword } from '@/lib/services/account-settings'

/** A new password (the current one needed); every other session ends. */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'required', body: passwordChangeSchema }, async ({ request, user, sessionId, body }) =>
  Response.json(await changePassword(user, sessionId, body, { clientAddress: requestAddress(request) })),
)
