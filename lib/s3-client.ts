import { S3Client } from '@aws-sdk/client-s3'
import type { ObjectStoreSettings } from '@/lib/env'

/**
 * An S3 client for the configured object store (lib/env.ts `objectStoreSettings`), set up one way
 * for the app (lib/object-store.ts), the backup script, the demo's seed and the tests. Not
 * server-only, so scripts and tests can use it.
 *
 * @example s3ClientFor({ endpoint: 'http://127.0.0.1:54330', bucket: 'wreathwright', region: 'us-east-1', credentials: undefined, keyPrefix: '' }).config.forcePathStyle // true
 */
export function s3ClientFor(settings: ObjectStoreSettings, options: { maxAttempts?: number } = {}): S3Client {
  return new S3Client({
    endpoint: settings.endpoint,
    region: settings.region,
    credentials: settings.credentials,
    // Path-style addresses (endpoint/bucket/key) work with every S3-compatible server.
    forcePathStyle: true,
    // Checksums only where S3 requires them: S3-compatible servers differ in the newer ones.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    ...(options.maxAttempts !== undefined ? { maxAttempts: options.maxAttempts } : {}),
  })
}
