import 'server-only'
import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, type S3Client } from '@aws-sdk/client-s3'
import { objectStoreSettings, type ObjectStoreSettings } from '@/lib/env'
import { s3ClientFor } from '@/lib/s3-client'
import { ServiceError } from '@/lib/errors'

/**
 * The object store, reached only through the S3 SDK (any S3-compatible service; the demo and the
 * tests start a local one on loopback, scripts/object-store.ts). Keys are built here from the
 * S3_KEY_PREFIX setting; the bucket is S3_BUCKET.
 */

const globalForStore = globalThis as typeof globalThis & { wreathwrightS3?: { client: S3Client; settings: ObjectStoreSettings } }

/** The configured store, or 503 when this server has none. */
function store(): { client: S3Client; settings: ObjectStoreSettings } {
  if (!globalForStore.wreathwrightS3) {
    const settings = objectStoreSettings()
    if (!settings) throw new ServiceError('Uploads are not set up on this server (no object store is configured).', 503)
    const client = s3ClientFor(settings, { maxAttempts: 2 })
    globalForStore.wreathwrightS3 = { client, settings }
  }
  return globalForStore.wreathwrightS3
}

/** The object key of a name, with the configured prefix. */
export function objectKey(name: string): string {
  return `${store().settings.keyPrefix}${name}`
}

export async function putObject(key: string, body: Uint8Array, contentType: string): Promise<void> {
  const { client, settings } = store()
  await client.send(new PutObjectCommand({ Bucket: settings.bucket, Key: key, Body: body, ContentType: contentType, ContentLength: body.byteLength }))
}

/** The object as a stream with its length; null when it is not there. */
export async function getObject(key: string): Promise<{ body: ReadableStream<Uint8Array>; length: number | undefined } | null> {
  const { client, settings } = store()
  try {
    const answer = await client.send(new GetObjectCommand({ Bucket: settings.bucket, Key: key }))
    if (!answer.Body) return null
    return { body: answer.Body.transformToWebStream() as ReadableStream<Uint8Array>, length: answer.ContentLength }
  } catch (error) {
    if (error instanceof NoSuchKey) return null
    throw error
  }
}

export async function deleteObject(key: string): Promise<void> {
  const { client, settings } = store()
  await client.send(new DeleteObjectCommand({ Bucket: settings.bucket, Key: key }))
}
