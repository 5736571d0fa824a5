import { BODY_LIMITS, route } from '@/lib/http'
import { getLicensedPattern } from '@/lib/services/licences'

/** `GET /api/library/:licenceId` → `{ licence, pattern: { id, name, revision, design } }`: the design file, for its licence holder only. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => getLicensedPattern(user, params.id) },
  async ({ resource }) => Response.json(resource),
)
