import { parseBody, route } from '@/lib/http'
import { createPatternSchema } from '@/lib/schemas/pattern'
import { createPattern, listOwnPatterns } from '@/lib/services/patterns'

export const GET = route(async ({ user }) => Response.json({ patterns: await listOwnPatterns(user) }))

export const POST = route(async ({ request, user }) => {
  const pattern = await createPattern(user, await parseBody(request, createPatternSchema))
  return Response.json({ pattern }, { status: 201 })
})
