import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { signUpSchema } from '@/lib/schemas/account'
import { signUp } from '@/lib/services/accounts'

/** 202 with the same body for every address; no session (the person signs in afterwards). */
export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: signUpSchema }, async ({ request, body }) => {
  const answer = await signUp(body, { clientAddress: requestAddress(request) })
  return Response.json(answer, { status: 202 })
})
