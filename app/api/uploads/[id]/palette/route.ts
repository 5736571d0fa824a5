import { BODY_LIMITS, route } from '@/lib/http'
import { authorizeUploadRead } from '@/lib/services/uploads'

/**
 * The palette proposed from a theme-fabric photo when it was uploaded (`#rrggbb` colours; null
 * for an upload of another kind), to whoever may read the photo itself: the board shows it beside
 * the photo a colourway names. 404 alike for a missing upload and someone else's.
 */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizeUploadRead(user, params.id) },
  async ({ resource: upload }) => Response.json({ palette: upload.palette }, { headers: { 'cache-control': 'private, no-store' } }),
)
