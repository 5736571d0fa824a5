import { requestAddress } from '@/lib/client-address'
import { BODY_LIMITS, route } from '@/lib/http'
import { signInSchema } from '@/lib/schemas/account'
import { signIn } from '@/lib/services/accounts'

export const POST = route({ bodyLimit: BODY_LIMITS.form, session: 'optional', body: signInSchema }, async ({ request, body, sessionId }) => {
  const { account, sessionCookie } = await signIn(body, {
    clientAddress: requestAddress(request),
    replacingSessionId: sessionId,
    userAgent: request.headers.get('user-agent'),
  })
  return Response.json({ account }, { headers: { 'set-cookie': sessionCookie } })
})
