import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { emailChangeSchema } from '@/lib/schemas/account'
import { requestEmailChange } from '@/lib/services/account-settings'

/** Starts an address change: a link to the new address, a notice to the current one. */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'required', body: emailChangeSchema }, async ({ request, user, body }) =>
  Response.json(await requestEmailChange(user, body, { clientAddress: requestAddress(request) }), { status: 202 }),
)
