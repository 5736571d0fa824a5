/** The part of s3rver 3.7.1 (plain JavaScript, no types of its own) that scripts/object-store.ts uses. */
declare module 's3rver' {
  import type { AddressInfo } from 'node:net'

  interface S3rverOptions {
    port?: number
    address?: string
    directory: string
    silent?: boolean
    resetOnClose?: boolean
    configureBuckets?: { name: string; configs?: (string | Buffer)[] }[]
  }

  export default class S3rver {
    constructor(options: S3rverOptions)
    run(): Promise<AddressInfo>
    close(): Promise<void>
  }
}
