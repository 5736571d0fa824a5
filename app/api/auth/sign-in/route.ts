import { parseBody, route } from '@/lib/http'
import { signInSchema } from '@/lib/schemas/account'
import { signIn } from '@/lib/services/accounts'

export const POST = route(async ({ request }) => {
  const { account, sessionCookie } = await signIn(await parseBody(request, signInSchema))
  return Response.json({ account }, { headers: { 'set-cookie': sessionCookie } })
})
