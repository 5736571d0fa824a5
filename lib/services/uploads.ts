import 'server-only'
import { randomUUID } from 'node:crypto'
import type { Transaction } from 'sequelize'
import { authorize, isPublicUpload, type Actor, type UploadFacts, type UploadPurpose } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError, ServiceError } from '@/lib/errors'
import { MAX_COVER_SIDE, MAX_IMAGE_SIDE, prepareImage, proposePalette, sniffImageType } from '@/lib/images'
import { MAX_STORED_UPLOAD_BYTES_PER_USER } from '@/lib/limits'
import { deleteObject, getObject, objectKey, putObject } from '@/lib/object-store'
import { countUpload } from '@/lib/rate-limits'
import { reportPatternsOfPhoto } from '@/lib/services/reports'
import { testedPatternsShowing } from '@/lib/services/testers'
import type { UploadView } from '@/lib/schemas/upload'
import { Pattern, Upload } from '@/models'

/**
 * Uploaded images: checked, remade (lib/images.ts) and stored in the object store, with a row in
 * `uploads` saying whose it is. Nothing is stored for a refused file: every check runs before the
 * object is written, and the object is removed again if its row cannot be written.
 *
 * Each person's uploads are limited twice: attempts per window (lib/rate-limits.ts,
 * `uploadsPerUser`: 429 with Retry-After), and the bytes stored together
 * (`MAX_STORED_UPLOAD_BYTES_PER_USER`, lib/limits.ts: 413 naming the quota and the use). The quota
 * is checked and the row written under a per-person lock, so uploads sent at once cannot pass it
 * together.
 */

const EXTENSIONS = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' } as const
/** How many of one's uploads of a kind the list shows, newest first. */
const LIST_LIMIT = 20
/** Objects removed from the store at the same time. */
const REMOVE_AT_ONCE = 8
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

/**
 * The permission step of an upload, before its body is read: the person may upload this kind, and
 * is counted against the uploads rate limit (429 past it), so a refused person's file is never read.
 */
export async function beginUpload(actor: Actor, purpose: UploadPurpose): Promise<UploadPurpose> {
  authorize(actor, 'upload-image', purpose)
  await countUpload(actor.id)
  return purpose
}

/** Megabytes (10^6 bytes) to one decimal, rounded up so a use just over a limit never reads as the limit: 1,234,567 bytes is 1.3 MB. */
function megabytes(bytes: number): string {
  return `${(Math.ceil(bytes / 100_000) / 10).toFixed(1)} MB`
}

/** Holds the person's upload lock until the transaction ends (a PostgreSQL advisory lock keyed by their id). */
async function lockUploadsOf(userId: string, transaction: Transaction): Promise<void> {
  await database().query('SELECT pg_advisory_xact_lock(hashtextextended(:key, 0))', { replacements: { key: `uploads:${userId}` }, transaction })
}

/** Checks, remakes and stores an image; a theme-fabric photo gets its proposed palette. */
export async function createUpload(actor: Actor, purpose: UploadPurpose, bytes: Uint8Array, declaredType: string | null): Promise<UploadView> {
  authorize(actor, 'upload-image', purpose)
  const contentType = await sniffImageType(bytes, declaredType)
  // A cover is stored at the size the shop shows it, so no page resizes it per request.
  const image = await prepareImage(bytes, contentType, purpose === 'cover' ? MAX_COVER_SIDE : MAX_IMAGE_SIDE)
  const palette = purpose === 'fabric-photo' ? await proposePalette(image) : null
  const id = randomUUID()
  const key = objectKey(`uploads/${actor.id}/${purpose}/${id}.${EXTENSIONS[contentType]}`)
  let stored = false
  try {
    return await database().transaction(async (transaction) => {
      await lockUploadsOf(actor.id, transaction)
      const used = Number((await Upload.sum('bytes', { where: { ownerId: actor.id }, transaction })) ?? 0)
      if (used + image.bytes.byteLength > MAX_STORED_UPLOAD_BYTES_PER_USER) {
        throw new ServiceError(
          `This image would take your uploads past your storage quota of ${megabytes(MAX_STORED_UPLOAD_BYTES_PER_USER)}: you use ${megabytes(used)} and it needs ${megabytes(image.bytes.byteLength)} once resized. Nothing was stored.`,
          413,
        )
      }
      await putObject(key, image.bytes, contentType)
      stored = true
      const upload = await Upload.create(
        { id, ownerId: actor.id, kind: purpose, key, contentType, width: image.width, height: image.height, bytes: image.bytes.byteLength, palette },
        { transaction },
      )
      return toView(upload)
    })
  } catch (error) {
    // The row was not written (or its transaction did not commit): the object goes too.
    if (stored) await deleteObject(key).catch((cleanup: Error) => console.error(`uploads: could not remove ${key} after a failed save: ${cleanup.message}`))
    throw error
  }
}

/**
 * Removes everything a person uploaded: each object from the object store, then their rows. For
 * deleting an account: call it before the user row goes (the rows would go with it, by the
 * foreign key, and leave the objects behind). Safe to run again if it fails part way: the rows of
 * objects not yet removed stay, and removing a missing object is no error. Returns how many
 * uploads were removed.
 *
 * @example await removeUploadsOf(user.id) // 3
 */
export async function removeUploadsOf(userId: string): Promise<number> {
  if (!UUID.test(userId)) return 0
  return database().transaction(async (transaction) => {
    // Uploads under way wait for this, then find the person gone.
    await lockUploadsOf(userId, transaction)
    const uploads = await Upload.findAll({ where: { ownerId: userId }, attributes: ['id', 'key'], transaction })
    for (let start = 0; start < uploads.length; start += REMOVE_AT_ONCE) {
      await Promise.all(uploads.slice(start, start + REMOVE_AT_ONCE).map((upload) => deleteObject(upload.key)))
    }
    await Upload.destroy({ where: { ownerId: userId }, transaction })
    return uploads.length
  })
}

/** The upload, if the actor may read it; 404 alike for a missing one and someone else's. */
export async function authorizeUploadRead(actor: Actor, id: string): Promise<Upload> {
  database()
  const upload = UUID.test(id) ? await Upload.findByPk(id) : null
  if (!upload) throw new NotFoundError('No such upload.')
  // A report photo is also shown to the designer and testers of the patterns whose reports show it.
  const reportPatterns = upload.kind === 'report-photo' ? await reportPatternsOfPhoto(upload.id) : undefined
  // A swatch or theme photo is also shown to the testers of the patterns that use it (their booklets draw the swatches).
  const designPatterns = upload.kind !== 'report-photo' && actor && actor.id !== upload.ownerId ? await testedPatternsShowing(actor.id, upload.id) : undefined
  authorize(actor, 'read-upload', { ownerId: upload.ownerId, reportPatterns, designPatterns })
  return upload
}

/** The patterns that show an upload as their cover, as the permission rules need them (lib/authorization.ts `isPublicUpload`). */
async function patternsShowingCover(uploadId: string): Promise<NonNullable<UploadFacts['coverOf']>> {
  const patterns = await Pattern.findAll({ where: { coverUploadId: uploadId }, attributes: ['ownerId', 'state', 'hiddenAt'] })
  return patterns.map((pattern) => ({ ownerId: pattern.ownerId, state: pattern.state, hidden: pattern.hiddenAt !== null }))
}

/**
 * A cover image, if the actor may read it: everyone (signed in or not) while a pattern showing it
 * is listed in the shop; otherwise as any upload (its owner, admins). Anything else, another kind
 * of upload included, is 404 alike: this address serves covers only.
 *
 * @example const upload = await authorizeCoverRead(null, listing.coverUploadId)
 */
export async function authorizeCoverRead(actor: Actor, id: string): Promise<{ upload: Upload; isPublic: boolean }> {
  database()
  const upload = UUID.test(id) ? await Upload.findByPk(id) : null
  if (!upload || upload.kind !== 'cover') throw new NotFoundError('No such cover.')
  const facts: UploadFacts = { ownerId: upload.ownerId, kind: upload.kind, coverOf: await patternsShowingCover(upload.id) }
  if (isPublicUpload(facts)) return { upload, isPublic: true }
  if (!actor) throw new NotFoundError('No such cover.')
  authorize(actor, 'read-upload', facts)
  return { upload, isPublic: false }
}

/**
 * Removes a cover upload no pattern shows any more (replaced or taken off), so that old covers do
 * not use up the designer's storage quota: its row in the caller's transaction; the caller removes
 * the object, whose key this returns, once that transaction has committed. Null when it stays
 * (another pattern still shows it, or it is not a cover).
 */
export async function forgetUnusedCover(uploadId: string, transaction: Transaction): Promise<string | null> {
  const upload = await Upload.findByPk(uploadId, { attributes: ['id', 'kind', 'key'], transaction })
  if (!upload || upload.kind !== 'cover') return null
  if ((await Pattern.count({ where: { coverUploadId: uploadId }, transaction })) > 0) return null
  await Upload.destroy({ where: { id: uploadId }, transaction })
  return upload.key
}

/** Removes an object whose row is gone; a failure is logged (the object is then only a stray file in the store). */
export async function removeStoredObject(key: string): Promise<void> {
  await deleteObject(key).catch((error: Error) => console.error(`uploads: could not remove ${key}: ${error.message}`))
}

/** The actor's own uploads of one kind, newest first. */
export async function listOwnUploads(actor: Actor, purpose: UploadPurpose): Promise<UploadView[]> {
  authorize(actor, 'upload-image', purpose)
  database()
  const uploads = await Upload.findAll({ where: { ownerId: actor.id, kind: purpose }, order: [['createdAt', 'DESC'], ['id', 'ASC']], limit: LIST_LIMIT })
  return uploads.map(toView)
}

/**
 * The stored image as an answer: its type, no sniffing, never cached by others — but a cover the
 * shop shows to everyone (`isPublic`) may be kept by any cache for five minutes: its address names
 * the upload, whose bytes never change, and five minutes bounds how long it still shows after the
 * pattern leaves the shop (our choice).
 */
export async function uploadResponse(upload: Upload, options: { isPublic?: boolean } = {}): Promise<Response> {
  const object = await getObject(upload.key)
  if (!object) throw new NotFoundError('The image of this upload is missing from the store.')
  const headers = new Headers({
    'content-type': upload.contentType,
    'x-content-type-options': 'nosniff',
    'cache-control': options.isPublic ? 'public, max-age=300' : 'private, no-store',
    'content-disposition': `inline; filename="${upload.id}.${EXTENSIONS[upload.contentType]}"`,
  })
  if (object.length !== undefined) headers.set('content-length', String(object.length))
  return new Response(object.body, { headers })
}
