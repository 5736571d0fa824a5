/**
 * Uploaded covers for two of the demo season's patterns, so the shop shows both kinds of cover: a
 * picture generated here (a ring of dots on a ground, in the first colourway's colours), never a
 * real photo. Stored the way lib/services/uploads.ts stores a cover (the same object key layout, a
 * PNG at the shop's cover size, a row in `uploads` owned by the designer) and named by the pattern's
 * `cover_upload_id`, through the S3 SDK directly as scripts/demo-photos.ts does (the service is
 * server-only code). A pattern that already has a cover keeps it.
 */
import { randomUUID } from 'node:crypto'
import { PutObjectCommand } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import { Op, type Transaction } from 'sequelize'
import { objectStoreSettings } from '../lib/env'
import { s3ClientFor } from '../lib/s3-client'
import { Pattern, Upload } from '../models'

/** The side of a demo cover, pixels: lib/images.ts MAX_COVER_SIDE, the size an uploaded cover is stored at. */
const COVER_SIDE = 960

interface DemoCover {
  readonly pattern: string
  /** The ground, the ring of dots, and the dots' centres. */
  readonly ground: string
  readonly ring: string
  readonly centre: string
  readonly dots: number
}

/** The season's patterns that show an uploaded cover (the others, the demo wreath among them, show the drawn ring). */
export const DEMO_COVERS: readonly DemoCover[] = [
  { pattern: 'Rosehip Garland', ground: '#efe6d5', ring: '#b23a48', centre: '#c0392b', dots: 12 },
  { pattern: 'Tidepool Halo', ground: '#1f4e5f', ring: '#cfe8e3', centre: '#2a7f8f', dots: 8 },
]

/** A square PNG: `dots` circles around a ring on the ground, each with a smaller one inside. */
async function coverImage(cover: DemoCover): Promise<Buffer> {
  const middle = COVER_SIDE / 2
  const radius = COVER_SIDE * 0.32
  const circles = Array.from({ length: cover.dots }, (_, index) => {
    const angle = (2 * Math.PI * index) / cover.dots
    const [x, y] = [middle + radius * Math.cos(angle), middle + radius * Math.sin(angle)]
    return `<circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${(COVER_SIDE * 0.09).toFixed(1)}" fill="${cover.ring}"/><circle cx="${x.toFixed(1)}" cy="${y.toFixed(1)}" r="${(COVER_SIDE * 0.035).toFixed(1)}" fill="${cover.centre}"/>`
  }).join('')
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${COVER_SIDE}" height="${COVER_SIDE}"><rect width="100%" height="100%" fill="${cover.ground}"/><circle cx="${middle}" cy="${middle}" r="${radius}" fill="none" stroke="${cover.ring}" stroke-width="${COVER_SIDE * 0.02}"/>${circles}</svg>`
  return sharp(Buffer.from(svg)).png().toBuffer()
}

/**
 * Gives each pattern of DEMO_COVERS that has no cover yet its generated one. Returns how many were
 * stored; 0 when no object store is configured (the shop then draws every cover).
 */
export async function seedDemoCovers(transaction: Transaction): Promise<number> {
  const settings = objectStoreSettings()
  if (!settings) return 0
  const patterns = await Pattern.findAll({
    where: { name: { [Op.in]: DEMO_COVERS.map((cover) => cover.pattern) }, coverUploadId: null },
    attributes: ['id', 'name', 'ownerId'],
    transaction,
  })
  if (patterns.length === 0) return 0
  const client = s3ClientFor(settings, { maxAttempts: 2 })
  try {
    for (const pattern of patterns) {
      const cover = DEMO_COVERS.find((candidate) => candidate.pattern === pattern.name)!
      const bytes = await coverImage(cover)
      const id = randomUUID()
      const key = `${settings.keyPrefix}uploads/${pattern.ownerId}/cover/${id}.png`
      await client.send(new PutObjectCommand({ Bucket: settings.bucket, Key: key, Body: bytes, ContentType: 'image/png', ContentLength: bytes.byteLength }))
      await Upload.create({ id, ownerId: pattern.ownerId, kind: 'cover', key, contentType: 'image/png', width: COVER_SIDE, height: COVER_SIDE, bytes: bytes.byteLength, palette: null }, { transaction })
      await Pattern.update({ coverUploadId: id }, { where: { id: pattern.id }, transaction, hooks: false })
    }
    return patterns.length
  } finally {
    client.destroy()
  }
}
