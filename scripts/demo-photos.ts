/**
 * Generated "photos" for the demo's test reports: a block of one fabric colour with a band of
 * another across it, never a real photo. Stored the way lib/services/uploads.ts stores a report
 * photo (the same object key layout, a PNG re-encoded by sharp, a row in `uploads` owned by the
 * tester), but through the S3 SDK directly: the service is server-only code, which the seed
 * script (run by tsx, outside Next.js) cannot import.
 */
import { randomUUID } from 'node:crypto'
import { PutObjectCommand } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import type { Transaction } from 'sequelize'
import { objectStoreSettings } from '../lib/env'
import { s3ClientFor } from '../lib/s3-client'
import { Upload } from '../models'

export interface DemoPhoto {
  readonly base: string
  readonly band: string
}

/** A 480 × 360 PNG: the base colour with a band of the other across its middle third. */
async function demoImage(photo: DemoPhoto): Promise<Buffer> {
  const band = await sharp({ create: { width: 480, height: 120, channels: 3, background: photo.band } }).png().toBuffer()
  return sharp({ create: { width: 480, height: 360, channels: 3, background: photo.base } })
    .composite([{ input: band, left: 0, top: 120 }])
    .png()
    .toBuffer()
}

/**
 * Stores the photos for `ownerId` and returns their upload ids, or null when no object store is
 * configured (the demo's reports then go without photos).
 */
export async function storeDemoPhotos(ownerId: string, photos: readonly DemoPhoto[], transaction: Transaction): Promise<string[] | null> {
  const settings = objectStoreSettings()
  if (!settings) return null
  const client = s3ClientFor(settings, { maxAttempts: 2 })
  try {
    const ids: string[] = []
    for (const photo of photos) {
      const bytes = await demoImage(photo)
      const id = randomUUID()
      const key = `${settings.keyPrefix}uploads/${ownerId}/report-photo/${id}.png`
      await client.send(new PutObjectCommand({ Bucket: settings.bucket, Key: key, Body: bytes, ContentType: 'image/png', ContentLength: bytes.byteLength }))
      await Upload.create({ id, ownerId, kind: 'report-photo', key, contentType: 'image/png', width: 480, height: 360, bytes: bytes.byteLength, palette: null }, { transaction })
      ids.push(id)
    }
    return ids
  } finally {
    client.destroy()
  }
}
