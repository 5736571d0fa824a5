import { DeleteObjectsCommand, ListObjectsV2Command, type S3Client } from '@aws-sdk/client-s3'
import { objectStoreSettings } from '@/lib/env'
import { s3ClientFor } from '@/lib/s3-client'

/**
 * The test run's object store (started by scripts/run-tests.ts), looked at through the S3 SDK as
 * the app sees it: what is in the bucket, and emptying it before each test.
 */
function store(): { client: S3Client; bucket: string } {
  const settings = objectStoreSettings()
  if (!settings) throw new Error('S3_ENDPOINT and S3_BUCKET are not set: run integration tests through `npm test`')
  const client = s3ClientFor(settings)
  return { client, bucket: settings.bucket }
}

/** Every key in the bucket. */
export async function storedKeys(): Promise<string[]> {
  const { client, bucket } = store()
  const keys: string[] = []
  let token: string | undefined
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket, ContinuationToken: token }))
    keys.push(...(page.Contents ?? []).map((object) => object.Key!))
    token = page.NextContinuationToken
  } while (token)
  return keys
}

export async function emptyBucket(): Promise<void> {
  const keys = await storedKeys()
  if (keys.length === 0) return
  const { client, bucket } = store()
  await client.send(new DeleteObjectsCommand({ Bucket: bucket, Delete: { Objects: keys.map((Key) => ({ Key })) } }))
}
