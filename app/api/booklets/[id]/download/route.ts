import { BODY_LIMITS, route } from '@/lib/http'
import { openBookletDownload } from '@/lib/services/booklets'

/**
 * `GET /api/booklets/:id/download?token=…`: the stored PDF, as an attachment, for the licence
 * holder with an unexpired link of theirs (anyone else 404; an expired or altered link 403). The
 * object store is never reached any other way.
 */
export const GET = route(
  {
    params: ['id'],
    bodyLimit: BODY_LIMITS.none,
    session: 'required',
    permit: ({ user, params, request }) => openBookletDownload(user, params.id, new URL(request.url).searchParams.get('token')),
  },
  async ({ resource }) => {
    const headers = new Headers({
      'content-type': 'application/pdf',
      'content-disposition': `attachment; filename="${resource.fileName}"`,
      'cache-control': 'private, no-store',
      'x-content-type-options': 'nosniff',
    })
    if (resource.length !== undefined) headers.set('content-length', String(resource.length))
    return new Response(resource.body, { headers })
  },
)
