import { parseBody, route } from '@/lib/http'
import { signUpSchema } from '@/lib/schemas/account'
import { signUp } from '@/lib/services/accounts'

export const POST = route(async ({ request }) => {
  const { account, sessionCookie } = await signUp(await parseBody(request, signUpSchema))
  return Response.json({ account }, { status: 201, headers: { 'set-cookie': sessionCookie } })
})
