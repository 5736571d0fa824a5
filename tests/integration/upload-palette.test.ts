/**
 * `GET /api/uploads/:id/palette` against the real PostgreSQL and object store: the palette stored
 * with a theme-fabric photo, to whoever may read the photo itself (its owner, an admin), and a 404
 * alike for someone else's upload and one that does not exist.
 */
import sharp from 'sharp'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as readPalette } from '@/app/api/uploads/[id]/palette/route'
import { POST as postUpload } from '@/app/api/uploads/route'
import type { Role } from '@/lib/roles'
import { closeDatabase, freshDatabase } from '../support/database'
import { createUser, sessionCookieFor } from '../support/factories'
import { emptyBucket } from '../support/object-store'
import { call, TEST_ORIGIN } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await emptyBucket()
})
afterAll(closeDatabase)

async function personWith(roles: Role[]) {
  const user = await createUser({ roles })
  return { user, cookie: await sessionCookieFor(user) }
}

/** Two stripes, a made-up "fabric": its palette is not empty. */
async function twoStripes(): Promise<Uint8Array> {
  const half = await sharp({ create: { width: 40, height: 80, channels: 3, background: '#2f5d50' } }).png().toBuffer()
  return sharp({ create: { width: 80, height: 80, channels: 3, background: '#d9a441' } }).composite([{ input: half, left: 0, top: 0 }]).png().toBuffer()
}

async function upload(cookie: string, kind: 'fabric-photo' | 'swatch'): Promise<{ id: string; palette: string[] | null }> {
  const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': 'image/png', cookie })
  const response = await postUpload(new Request(`${TEST_ORIGIN}/api/uploads?kind=${kind}`, { method: 'POST', headers, body: new Blob([new Uint8Array(await twoStripes())]) }))
  expect(response.status).toBe(201)
  return ((await response.json()) as { upload: { id: string; palette: string[] | null } }).upload
}

const palette = (id: string, cookie?: string) => call(readPalette, { path: `/api/uploads/${id}/palette`, params: { id }, cookie })

describe('the palette of an upload', () => {
  it('answers the palette stored with a theme-fabric photo to its owner, and null for a swatch', async () => {
    const { cookie } = await personWith(['designer'])
    const photo = await upload(cookie, 'fabric-photo')
    expect(photo.palette?.length).toBeGreaterThan(0)
    const answer = await palette(photo.id, cookie)
    expect(answer.status).toBe(200)
    expect(answer.json).toEqual({ palette: photo.palette })
    expect(answer.headers.get('cache-control')).toBe('private, no-store')
    const swatch = await upload(cookie, 'swatch')
    expect((await palette(swatch.id, cookie)).json).toEqual({ palette: null })
  })

  it('is read as the photo is: an admin may, another designer gets 404 as for no upload, a stranger 401', async () => {
    const owner = await personWith(['designer'])
    const photo = await upload(owner.cookie, 'fabric-photo')
    const other = await personWith(['designer'])
    const refused = await palette(photo.id, other.cookie)
    expect(refused.status).toBe(404)
    const missing = await palette('00000000-0000-4000-8000-000000000000', other.cookie)
    expect(missing.status).toBe(404)
    expect(refused.json).toEqual(missing.json)
    expect((await palette('not-an-id', other.cookie)).status).toBe(404)
    const admin = await personWith(['admin'])
    expect((await palette(photo.id, admin.cookie)).json).toEqual({ palette: photo.palette })
    expect((await palette(photo.id)).status).toBe(401)
  })
})
