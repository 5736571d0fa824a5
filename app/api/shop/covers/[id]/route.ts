import { BODY_LIMITS, route } from '@/lib/http'
import { authorizeCoverRead, uploadResponse } from '@/lib/services/uploads'

/**
 * `GET /api/shop/covers/:id` → the image: a pattern's uploaded cover, open to everyone (no sign-in)
 * while a pattern showing it is listed in the shop; otherwise only to its owner and admins
 * (lib/authorization.ts `isPublicUpload`). Covers only: any other upload is 404 here.
 */
export const GET = route(
  { params: ['id'], bodyLimit: BODY_LIMITS.none, session: 'optional', permit: ({ user, params }) => authorizeCoverRead(user, params.id) },
  async ({ resource: { upload, isPublic } }) => uploadResponse(upload, { isPublic }),
)
