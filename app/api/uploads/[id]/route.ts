import { BODY_LIMITS, route } from '@/lib/http'
import { authorizeUploadRead, uploadResponse } from '@/lib/services/uploads'

/** The image, to its owner and those lib/authorization.ts lets read it; 404 to anyone else. */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'required', permit: ({ user, params }) => authorizeUploadRead(user, params.id) },
  async ({ resource: upload }) => uploadResponse(upload),
)
