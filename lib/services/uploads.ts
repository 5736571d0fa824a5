import 'server-only'
import { randomUUID } from 'node:crypto'
import { authorize, type Actor, type UploadPurpose } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError } from '@/lib/errors'
import { prepareImage, proposePalette, sniffImageType } from '@/lib/images'
import { deleteObject, getObject, objectKey, putObject } from '@/lib/object-store'
import type { UploadView } from '@/lib/schemas/upload'
import { Upload } from '@/models'

/**
 * Uploaded images: checked, remade (lib/images.ts) and stored in the object store, with a row in
 * `uploads` saying whose it is. Nothing is stored for a refused file: every check runs before the
 * object is written, and the object is removed again if its row cannot be written.
 */

const EXTENSIONS = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' } as const
/** How many of one's uploads of a kind the list shows, newest first. */
const LIST_LIMIT = 20
const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

function toView(upload: Upload): UploadView {
  return {
    id: upload.id,
    kind: upload.kind,
    contentType: upload.contentType,
    width: upload.width,
    height: upload.height,
    bytes: upload.bytes,
    palette: upload.palette,
    url: `/api/uploads/${upload.id}`,
    createdAt: upload.createdAt.toISOString(),
  }
}

/** Checks, remakes and stores an image; a theme-fabric photo gets its proposed palette. */
export async function createUpload(actor: Actor, purpose: UploadPurpose, bytes: Uint8Array, declaredType: string | null): Promise<UploadView> {
  authorize(actor, 'upload-image', purpose)
  const contentType = await sniffImageType(bytes, declaredType)
  const image = await prepareImage(bytes, contentType)
  const palette = purpose === 'fabric-photo' ? await proposePalette(image) : null
  database()
  const id = randomUUID()
  const key = objectKey(`uploads/${actor.id}/${purpose}/${id}.${EXTENSIONS[contentType]}`)
  await putObject(key, image.bytes, contentType)
  try {
    const upload = await Upload.create({
      id,
      ownerId: actor.id,
      kind: purpose,
      key,
      contentType,
      width: image.width,
      height: image.height,
      bytes: image.bytes.byteLength,
      palette,
    })
    return toView(upload)
  } catch (error) {
    await deleteObject(key).catch((cleanup: Error) => console.error(`uploads: could not remove ${key} after a failed save: ${cleanup.message}`))
    throw error
  }
}

/** The upload, if the actor may read it; 404 alike for a missing one and someone else's. */
export async function authorizeUploadRead(actor: Actor, id: string): Promise<Upload> {
  database()
  const upload = UUID.test(id) ? await Upload.findByPk(id) : null
  if (!upload) throw new NotFoundError('No such upload.')
  authorize(actor, 'read-upload', upload)
  return upload
}

/** The actor's own uploads of one kind, newest first. */
export async function listOwnUploads(actor: Actor, purpose: UploadPurpose): Promise<UploadView[]> {
  authorize(actor, 'upload-image', purpose)
  database()
  const uploads = await Upload.findAll({ where: { ownerId: actor.id, kind: purpose }, order: [['createdAt', 'DESC'], ['id', 'ASC']], limit: LIST_LIMIT })
  return uploads.map(toView)
}

/** The stored image as an answer: its type, no sniffing, never cached by others. */
export async function uploadResponse(upload: Upload): Promise<Response> {
  const object = await getObject(upload.key)
  if (!object) throw new NotFoundError('The image of this upload is missing from the store.')
  const headers = new Headers({
    'content-type': upload.contentType,
    'x-content-type-options': 'nosniff',
    'cache-control': 'private, no-store',
    'content-disposition': `inline; filename="${upload.id}.${EXTENSIONS[upload.contentType]}"`,
  })
  if (object.length !== undefined) headers.set('content-length', String(object.length))
  return new Response(object.body, { headers })
}
