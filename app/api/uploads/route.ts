import { authorize, type UploadPurpose } from '@/lib/authorization'
import { ValidationError } from '@/lib/errors'
import { BODY_LIMITS, route } from '@/lib/http'
import { MAX_UPLOAD_BYTES } from '@/lib/images'
import { uploadPurposeSchema } from '@/lib/schemas/upload'
import { beginUpload, createUpload, listOwnUploads } from '@/lib/services/uploads'

/** `?kind=fabric-photo|swatch`: what the image is for; 422 otherwise. */
function purposeOf(request: Request): UploadPurpose {
  const parsed = uploadPurposeSchema.safeParse(new URL(request.url).searchParams.get('kind'))
  if (!parsed.success) throw new ValidationError([{ path: 'kind', message: parsed.error.issues[0]?.message ?? 'Unknown kind.' }])
  return parsed.data
}

/** The permission step of both: the kind is known and the person may upload that kind. */
function permitKind({ user, request }: { user: Parameters<typeof authorize>[0]; request: Request }): UploadPurpose {
  const purpose = purposeOf(request)
  authorize(user, 'upload-image', purpose)
  return purpose
}

/** Your uploads of one kind, newest first (the fabric panel shows the latest theme photo and its palette). */
export const GET = route({ bodyLimit: BODY_LIMITS.none, session: 'required', permit: permitKind }, async ({ user, resource: purpose }) =>
  Response.json({ uploads: await listOwnUploads(user, purpose) }),
)

/**
 * Upload an image: the file itself as the body (JPEG, PNG or WebP, at most 10 MB), its type read
 * from the bytes. Answers 201 with the upload (a theme-fabric photo with its palette), or 413, 415
 * or 422 naming the problem, with nothing stored: 413 also when it would take the person's uploads
 * past their storage quota, 429 with Retry-After past the uploads rate limit (counted before the
 * body is read).
 */
export const POST = route(
  { bodyLimit: MAX_UPLOAD_BYTES, session: 'required', permit: ({ user, request }) => beginUpload(user, purposeOf(request)), body: 'bytes' },
  async ({ user, request, resource: purpose, body }) =>
    Response.json({ upload: await createUpload(user, purpose, body, request.headers.get('content-type')) }, { status: 201 }),
)
