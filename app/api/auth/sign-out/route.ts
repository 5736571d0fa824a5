import { BODY_LIMITS, route } from '@/lib/http'
import { signOut } from '@/lib/services/accounts'

export const POST = route({ bodyLimit: BODY_LIMITS.none, session: 'optional' }, async ({ sessionId }) => {
  const clearedCookie = await signOut(sessionId)
  return Response.json({ signedOut: true }, { headers: { 'set-cookie': clearedCookie } })
})
