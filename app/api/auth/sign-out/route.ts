import { route } from '@/lib/http'
import { signOut } from '@/lib/services/accounts'

export const POST = route(async ({ sessionId }) => {
  const clearedCookie = await signOut(sessionId)
  return Response.json({ signedOut: true }, { headers: { 'set-cookie': clearedCookie } })
})
