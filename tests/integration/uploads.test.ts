/**
 * Uploads against the real PostgreSQL and the real local object store (s3rver) that
 * scripts/run-tests.ts starts: what is refused leaves nothing in either; a good photo is remade,
 * stored, given a palette and shown only to its owner (and admins).
 */
import sharp, { type Sharp } from 'sharp'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as readUpload } from '@/app/api/uploads/[id]/route'
import { GET as listUploads, POST as postUpload } from '@/app/api/uploads/route'
import { MAX_IMAGE_SIDE, MAX_UPLOAD_BYTES } from '@/lib/images'
import { MAX_STORED_UPLOAD_BYTES_PER_USER } from '@/lib/limits'
import { colourDistance, type Rgb } from '@/lib/palette'
import { RATE_LIMITS } from '@/lib/rate-limits'
import type { Role } from '@/lib/roles'
import { removeUploadsOf } from '@/lib/services/uploads'
import { Upload } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, sessionCookieFor } from '../support/factories'
import { emptyBucket, storedKeys } from '../support/object-store'
import { TEST_ORIGIN } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await emptyBucket()
})
afterAll(closeDatabase)

async function personWith(roles: Role[]) {
  const user = await createUser({ roles })
  return { user, cookie: await sessionCookieFor(user) }
}

/** Posts raw bytes as a browser's fetch(file) would, with the file's type as Content-Type. */
async function upload(bytes: Uint8Array, contentType: string, options: { cookie?: string; kind?: string; contentLength?: string } = {}) {
  const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': contentType })
  if (options.cookie) headers.set('cookie', options.cookie)
  if (options.contentLength) headers.set('content-length', options.contentLength)
  const request = new Request(`${TEST_ORIGIN}/api/uploads?kind=${options.kind ?? 'fabric-photo'}`, { method: 'POST', headers, body: new Blob([new Uint8Array(bytes)]) })
  const response = await postUpload(request)
  return { status: response.status, headers: response.headers, json: (await response.json()) as { upload?: Record<string, unknown>; error?: { message: string } } }
}

async function read(id: string, cookie?: string) {
  const headers = new Headers(cookie ? { cookie } : {})
  return readUpload(new Request(`${TEST_ORIGIN}/api/uploads/${id}`, { headers }), { params: Promise.resolve({ id }) })
}

async function expectNothingStored() {
  expect(await Upload.count()).toBe(0)
  expect(await storedKeys()).toEqual([])
}

/** Vertical stripes of these colours, `stripe` pixels wide each: a made-up "fabric", never a photo. */
const STRIPES = ['#7b2d26', '#e8dcc4', '#2f5d50', '#d9a441', '#3b4f7a', '#a35d8c', '#1e1e1e', '#8fb3a1']
async function stripes(stripe: number, height: number): Promise<Sharp> {
  const tiles = await Promise.all(
    STRIPES.map(async (colour, i) => ({
      input: await sharp({ create: { width: stripe, height, channels: 3, background: colour } }).png().toBuffer(),
      left: i * stripe,
      top: 0,
    })),
  )
  return sharp({ create: { width: stripe * STRIPES.length, height, channels: 3, background: '#000000' } }).composite(tiles)
}

const rgbOf = (hex: string): Rgb => [parseInt(hex.slice(1, 3), 16), parseInt(hex.slice(3, 5), 16), parseInt(hex.slice(5, 7), 16)]

describe('refused uploads leave nothing stored', () => {
  it('refuses a file of 10 MB + 1 byte with 413, announced or not', async () => {
    const { cookie } = await personWith(['designer'])
    const tooBig = new Uint8Array(MAX_UPLOAD_BYTES + 1)
    const announced = await upload(tooBig, 'image/jpeg', { cookie, contentLength: String(tooBig.byteLength) })
    expect(announced.status).toBe(413)
    expect(announced.json.error?.message).toMatch(/larger than .*10485760 bytes/)
    // Without a length the body is counted as it comes and cut at the limit.
    const stream = new Blob([tooBig]).stream()
    const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': 'image/jpeg', cookie })
    const request = new Request(`${TEST_ORIGIN}/api/uploads?kind=fabric-photo`, { method: 'POST', headers, body: stream, duplex: 'half' } as RequestInit)
    expect((await postUpload(request)).status).toBe(413)
    await expectNothingStored()
  })

  it('refuses a PDF and a GIF with 415 saying what they are', async () => {
    const { cookie } = await personWith(['designer'])
    const pdf = new TextEncoder().encode('%PDF-1.4\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n')
    const asPdf = await upload(pdf, 'application/pdf', { cookie })
    expect(asPdf.status).toBe(415)
    expect(asPdf.json.error?.message).toMatch(/is a PDF file .*not a JPEG, PNG or WebP image/)
    const gif = await (await stripes(10, 10)).gif().toBuffer()
    const asGif = await upload(gif, 'image/gif', { cookie })
    expect(asGif.status).toBe(415)
    expect(asGif.json.error?.message).toMatch(/is a GIF file/)
    await expectNothingStored()
  })

  it('refuses a truncated JPEG with 422: damaged or cut short', async () => {
    const { cookie } = await personWith(['designer'])
    const jpeg = await (await stripes(50, 300)).jpeg().toBuffer()
    const cut = jpeg.subarray(0, Math.floor(jpeg.byteLength / 2))
    const answer = await upload(cut, 'image/jpeg', { cookie })
    expect(answer.status).toBe(422)
    expect(answer.json.error?.message).toMatch(/JPEG image could not be read: it looks damaged or cut short/)
    await expectNothingStored()
  })

  it('refuses a text file named .jpg and sent as image/jpeg with 415: not an image', async () => {
    const { cookie } = await personWith(['designer'])
    const text = new TextEncoder().encode('Cream tone-on-tone, 1/2 yd\nLeaf dark, fat quarter\n')
    const answer = await upload(text, 'image/jpeg', { cookie })
    expect(answer.status).toBe(415)
    expect(answer.json.error?.message).toBe(
      'The file was sent as an image (image/jpeg), but its contents are not a JPEG, PNG or WebP image. Send a JPEG, PNG or WebP image.',
    )
    await expectNothingStored()
  })

  it('refuses strangers (401), quilters (403) and an unknown kind (422)', async () => {
    const png = await (await stripes(10, 10)).png().toBuffer()
    expect((await upload(png, 'image/png')).status).toBe(401)
    const quilter = await personWith(['quilter'])
    expect((await upload(png, 'image/png', { cookie: quilter.cookie })).status).toBe(403)
    const designer = await personWith(['designer'])
    const unknown = await upload(png, 'image/png', { cookie: designer.cookie, kind: 'avatar' })
    expect(unknown.status).toBe(422)
    expect(unknown.json.error?.message).toMatch(/kind/)
    await expectNothingStored()
  })
})

describe('a theme-fabric photo', () => {
  it('is resized, stripped of metadata, stored, and proposes a palette of colours that occur in it', async () => {
    const owner = await personWith(['designer'])
    // 2400 × 1200 px with EXIF: stored at most MAX_IMAGE_SIDE wide, without the EXIF.
    const png = await (await stripes(300, 1200)).withExif({ IFD0: { Copyright: 'made in a test', Artist: 'test' } }).png().toBuffer()
    expect((await sharp(png).metadata()).exif).toBeDefined()
    const answer = await upload(png, 'image/png', { cookie: owner.cookie })
    expect(answer.status).toBe(201)
    const stored = answer.json.upload as { id: string; width: number; height: number; palette: string[]; contentType: string; url: string }
    expect(stored).toMatchObject({ width: MAX_IMAGE_SIDE, height: 800, contentType: 'image/png', url: `/api/uploads/${stored.id}` })

    const image = await read(stored.id, owner.cookie)
    expect(image.status).toBe(200)
    expect(image.headers.get('content-type')).toBe('image/png')
    expect(image.headers.get('x-content-type-options')).toBe('nosniff')
    const bytes = Buffer.from(await image.arrayBuffer())
    const metadata = await sharp(bytes).metadata()
    expect([metadata.width, metadata.height, metadata.exif]).toEqual([MAX_IMAGE_SIDE, 800, undefined])

    // 6–8 colours, each one within a small distance of a pixel of the stored (resized) image.
    expect(stored.palette.length).toBeGreaterThanOrEqual(6)
    expect(stored.palette.length).toBeLessThanOrEqual(8)
    for (const colour of stored.palette) expect(colour).toMatch(/^#[0-9a-f]{6}$/)
    const { data, info } = await sharp(bytes).removeAlpha().raw().toBuffer({ resolveWithObject: true })
    const occurring = new Set<string>()
    for (let i = 0; i < data.length; i += info.channels) occurring.add(`${data[i]},${data[i + 1]},${data[i + 2]}`)
    const pixels = [...occurring].map((key) => key.split(',').map(Number) as unknown as Rgb)
    // 0.02 in OKLab: about one just noticeable difference (from memory), far below any stripe's neighbour.
    for (const colour of stored.palette) {
      expect(Math.min(...pixels.map((pixel) => colourDistance(pixel, rgbOf(colour))))).toBeLessThan(0.02)
      expect(Math.min(...STRIPES.map((stripe) => colourDistance(rgbOf(stripe), rgbOf(colour))))).toBeLessThan(0.02)
    }
    // No two proposed colours are near-identical.
    for (const [i, a] of stored.palette.entries()) {
      for (const b of stored.palette.slice(i + 1)) expect(colourDistance(rgbOf(a), rgbOf(b))).toBeGreaterThan(0.04)
    }

    const keys = await storedKeys()
    expect(keys).toHaveLength(1)
    expect(keys[0]).toMatch(new RegExp(`uploads/${owner.user.id}/fabric-photo/${stored.id}\\.png$`))
    const row = await Upload.findByPk(stored.id)
    expect(row?.toJSON()).toMatchObject({ ownerId: owner.user.id, kind: 'fabric-photo', key: keys[0], bytes: bytes.byteLength, palette: stored.palette })
  })

  it('is stored as what its bytes are, whatever it was sent as; a swatch gets no palette', async () => {
    const { cookie } = await personWith(['designer'])
    const webp = await (await stripes(20, 40)).webp().toBuffer()
    const answer = await upload(webp, 'image/jpeg', { cookie, kind: 'swatch' })
    expect(answer.status).toBe(201)
    expect(answer.json.upload).toMatchObject({ kind: 'swatch', contentType: 'image/webp', width: 160, height: 40, palette: null })
  })

  it('is shown to its owner and admins; another designer gets 404 like a missing one, a stranger 401', async () => {
    const owner = await personWith(['designer'])
    const other = await personWith(['designer'])
    const admin = await personWith(['admin'])
    const answer = await upload(await (await stripes(20, 40)).jpeg().toBuffer(), 'image/jpeg', { cookie: owner.cookie })
    const id = (answer.json.upload as { id: string }).id
    expect((await read(id, owner.cookie)).status).toBe(200)
    expect((await read(id, admin.cookie)).status).toBe(200)
    const hidden = await read(id, other.cookie)
    expect(hidden.status).toBe(404)
    const missing = await read('00000000-0000-4000-8000-000000000000', other.cookie)
    expect(missing.status).toBe(404)
    expect(await hidden.json()).toEqual(await missing.json())
    expect((await read(id)).status).toBe(401)
    expect((await read('not-an-id')).status).toBe(401)

    const list = async (cookie: string) => {
      const response = await listUploads(new Request(`${TEST_ORIGIN}/api/uploads?kind=fabric-photo`, { headers: { cookie } }))
      return ((await response.json()) as { uploads: { id: string }[] }).uploads.map((u) => u.id)
    }
    expect(await list(owner.cookie)).toEqual([id])
    expect(await list(other.cookie)).toEqual([])
  })
})

/** Noise: every pixel random, so PNG cannot shrink it (about 3 bytes a pixel stored). */
function noise(width: number, height: number): Promise<Buffer> {
  const pixels = Buffer.alloc(width * height * 3)
  for (let i = 0; i < pixels.length; i += 1) pixels[i] = Math.floor(Math.random() * 256)
  return sharp(pixels, { raw: { width, height, channels: 3 } }).png().toBuffer()
}

describe('per-designer upload limits', () => {
  it(`refuses the upload after ${RATE_LIMITS.uploadsPerUser.points} in ${RATE_LIMITS.uploadsPerUser.windowSeconds / 60} minutes with 429 and Retry-After, storing nothing; others still upload`, async () => {
    const { cookie } = await personWith(['designer'])
    const png = await (await stripes(2, 4)).png().toBuffer()
    const { points, windowSeconds } = RATE_LIMITS.uploadsPerUser
    // 30 uploads per 10 minutes per designer (our choice; lib/rate-limits.ts).
    expect([points, windowSeconds]).toEqual([30, 600])
    for (let n = 1; n <= points; n += 1) expect((await upload(png, 'image/png', { cookie, kind: 'swatch' })).status).toBe(201)
    const refused = await upload(png, 'image/png', { cookie, kind: 'swatch' })
    expect(refused.status).toBe(429)
    expect(refused.json.error?.message).toBe('Too many uploads; try again in 10 minutes.')
    const retryAfter = Number(refused.headers.get('retry-after'))
    expect(retryAfter).toBeGreaterThan(0)
    expect(retryAfter).toBeLessThanOrEqual(windowSeconds)
    expect(await Upload.count()).toBe(points)
    expect(await storedKeys()).toHaveLength(points)
    // Refused uploads count too (each is an attempt): still refused.
    expect((await upload(png, 'image/png', { cookie, kind: 'swatch' })).status).toBe(429)
    const other = await personWith(['designer'])
    expect((await upload(png, 'image/png', { cookie: other.cookie, kind: 'swatch' })).status).toBe(201)
  })

  it('refuses an image that would take a designer past the storage quota with 413 naming the quota and the use, storing nothing', async () => {
    const owner = await personWith(['designer'])
    // 200 MB (10^6 bytes each) per designer, our choice (lib/limits.ts).
    expect(MAX_STORED_UPLOAD_BYTES_PER_USER).toBe(200_000_000)
    // Uploads already stored: 199.5 MB in all, as rows (their objects are not needed to count them).
    const used = MAX_STORED_UPLOAD_BYTES_PER_USER - 500_000
    await Upload.create({ ownerId: owner.user.id, kind: 'fabric-photo', key: 'uploads/earlier/photo.png', contentType: 'image/png', width: 1600, height: 1200, bytes: used, palette: null })
    // 600 × 600 px of noise: about 1.08 MB as a PNG (3 bytes a pixel), over the 0.5 MB left.
    const big = await noise(600, 600)
    expect(big.byteLength).toBeGreaterThan(1_000_000)
    const refused = await upload(big, 'image/png', { cookie: owner.cookie, kind: 'swatch' })
    expect(refused.status).toBe(413)
    expect(refused.json.error?.message).toMatch(/^This image would take your uploads past your storage quota of 200\.0 MB: you use 199\.5 MB and it needs 1\.\d MB once resized\. Nothing was stored\.$/)
    expect(await Upload.count()).toBe(1)
    expect(await storedKeys()).toEqual([])
    // What still fits is taken, and the quota is each designer's own.
    const small = await (await stripes(2, 4)).png().toBuffer()
    expect((await upload(small, 'image/png', { cookie: owner.cookie, kind: 'swatch' })).status).toBe(201)
    const other = await personWith(['designer'])
    expect((await upload(big, 'image/png', { cookie: other.cookie, kind: 'swatch' })).status).toBe(201)
  })

  it('lets uploads sent at once pass the quota only as far as it goes', async () => {
    const owner = await personWith(['designer'])
    const image = await noise(300, 300)
    // Room for exactly one more: each stored image is at least 200 KB of noise (300 × 300 × 3 = 270 kB raw).
    await Upload.create({ ownerId: owner.user.id, kind: 'fabric-photo', key: 'uploads/earlier/photo.png', contentType: 'image/png', width: 1600, height: 1200, bytes: MAX_STORED_UPLOAD_BYTES_PER_USER - 300_000, palette: null })
    const answers = await Promise.all([1, 2, 3].map(() => upload(image, 'image/png', { cookie: owner.cookie, kind: 'swatch' })))
    expect(answers.map((answer) => answer.status).sort()).toEqual([201, 413, 413])
    expect(await Upload.count()).toBe(2)
    expect(await storedKeys()).toHaveLength(1)
  })
})

describe('removing a person’s uploads (account deletion)', () => {
  it('deletes their objects from the store and their rows, and leaves everyone else’s', async () => {
    const leaving = await personWith(['designer'])
    const staying = await personWith(['designer'])
    const png = await (await stripes(20, 40)).png().toBuffer()
    for (const kind of ['fabric-photo', 'swatch', 'swatch']) expect((await upload(png, 'image/png', { cookie: leaving.cookie, kind })).status).toBe(201)
    const kept = await upload(png, 'image/png', { cookie: staying.cookie, kind: 'swatch' })
    const keptId = (kept.json.upload as { id: string }).id
    expect(await storedKeys()).toHaveLength(4)

    expect(await removeUploadsOf(leaving.user.id)).toBe(3)
    // Checked in the store itself through the S3 SDK: only the other designer's object is left.
    const keys = await storedKeys()
    expect(keys).toHaveLength(1)
    expect(keys[0]).toMatch(new RegExp(`uploads/${staying.user.id}/swatch/${keptId}\\.png$`))
    expect(await Upload.count({ where: { ownerId: leaving.user.id } })).toBe(0)
    expect((await Upload.findAll()).map((row) => row.id)).toEqual([keptId])
    expect((await read(keptId, staying.cookie)).status).toBe(200)
    // Again: nothing left to remove.
    expect(await removeUploadsOf(leaving.user.id)).toBe(0)
  })

  it('finishes a removal that failed part way: rows whose object is already gone are removed too', async () => {
    const leaving = await personWith(['designer'])
    const png = await (await stripes(20, 40)).png().toBuffer()
    for (let n = 0; n < 2; n += 1) expect((await upload(png, 'image/png', { cookie: leaving.cookie, kind: 'swatch' })).status).toBe(201)
    // The objects gone already, the rows not (as if an earlier removal had stopped in between).
    await emptyBucket()
    expect(await removeUploadsOf(leaving.user.id)).toBe(2)
    expect(await Upload.count()).toBe(0)
  })
})
