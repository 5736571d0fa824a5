/**
 * The local object store the demo and the tests start: s3rver, an S3-compatible server, on
 * loopback only, keeping its objects in a folder. The app reaches it only through the S3 SDK with
 * the settings `objectStoreEnv` returns, as it would reach a deployment's store.
 */
import fs from 'node:fs'
import S3rver from 's3rver'

export interface ObjectStore {
  readonly url: string
  readonly bucket: string
  readonly folder: string
  /** The app's settings for this store (lib/env.ts). */
  readonly env: Record<string, string>
  stop(): Promise<void>
}

/** s3rver's fixed key pair: it accepts only these, which keeps other clients out of it by mistake. */
const ACCESS_KEY_ID = 'S3RVER'
const SECRET_ACCESS_KEY = 'S3RVER'

/** Starts the store on 127.0.0.1:`port`, its objects in `folder`, with `bucket` made if missing. */
export async function startObjectStore(folder: string, port: number, bucket: string): Promise<ObjectStore> {
  fs.mkdirSync(folder, { recursive: true, mode: 0o700 })
  const server = new S3rver({ port, address: '127.0.0.1', directory: folder, silent: true, configureBuckets: [{ name: bucket }] })
  const address = await server.run()
  const url = `http://127.0.0.1:${address.port}`
  return {
    url,
    bucket,
    folder,
    env: { S3_ENDPOINT: url, S3_BUCKET: bucket, S3_ACCESS_KEY_ID: ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY: SECRET_ACCESS_KEY },
    stop: () => server.close(),
  }
}
