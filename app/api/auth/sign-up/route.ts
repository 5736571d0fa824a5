import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { signUpSchema } from '@/lib/schemas/account'
import { signUp } from '@/lib/services/accounts'

export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: signUpSchema }, async ({ request, body, sessionId }) => {
  const { account, sessionCookie } = await signUp(body, { clientAddress: requestAddress(request), replacingSessionId: sessionId })
  return Response.json({ account }, { status: 201, headers: { 'set-cookie': sessionCookie } })
})
