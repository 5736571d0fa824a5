import { route } from '@/lib/http'
import { listRevisions } from '@/lib/services/patterns'

export const GET = route<{ id: string }>(async ({ user, params }) =>
  Response.json({ revisions: await listRevisions(user, params.id) }),
)
