import { parseBody, route } from '@/lib/http'
import { updatePatternSchema } from '@/lib/schemas/pattern'
import { deletePattern, getPattern, updatePattern } from '@/lib/services/patterns'

type Params = { id: string }

export const GET = route<Params>(async ({ user, params }) => Response.json({ pattern: await getPattern(user, params.id) }))

export const PATCH = route<Params>(async ({ request, user, params }) => {
  const pattern = await updatePattern(user, params.id, await parseBody(request, updatePatternSchema))
  return Response.json({ pattern })
})

export const DELETE = route<Params>(async ({ user, params }) => {
  await deletePattern(user, params.id)
  return new Response(null, { status: 204 })
})
