/**
 * A designer's listing settings (`GET`/`PATCH /api/patterns/:id/listing`) against the real
 * PostgreSQL and object store: skill notes and an uploaded cover, who may set them, what the shop
 * then shows, and who may read a cover (`GET /api/shop/covers/:id`): everyone while its pattern is
 * listed, only its owner otherwise; never any other upload through that address.
 */
import sharp from 'sharp'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as readListing, PATCH as patchListing } from '@/app/api/patterns/[id]/listing/route'
import { GET as readCover } from '@/app/api/shop/covers/[id]/route'
import { GET as getOne } from '@/app/api/shop/patterns/[id]/route'
import { GET as listPatterns } from '@/app/api/shop/patterns/route'
import { POST as postUpload } from '@/app/api/uploads/route'
import { wreathFile } from '@/lib/booklet/test-support/designs'
import { MAX_COVER_SIDE } from '@/lib/images'
import { MAX_SKILL_NOTES_LENGTH } from '@/lib/limits'
import type { Role } from '@/lib/roles'
import type { PatternState } from '@/lib/schemas/pattern'
import { Invitation, Upload } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { emptyBucket, storedKeys } from '../support/object-store'
import { call, TEST_ORIGIN } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await emptyBucket()
})
afterAll(closeDatabase)

async function person(roles: Role[], displayName = 'Someone') {
  const user = await createUser({ roles, displayName })
  return { user, cookie: await sessionCookieFor(user) }
}

/** A priced pattern of `owner` in `state` (published by default). */
async function pattern(owner: { id: string }, state: PatternState = 'published', name = 'Cover ring') {
  const row = await createPatternRow(owner, { name, state, design: wreathFile({ name }) })
  await row.update({ priceCents: 1200, currency: 'USD' })
  return row
}

/** A made-up picture, never a photo: a wide block of one colour with a band of another, `width` × `width / 2`. */
async function picture(width = 2400): Promise<Buffer> {
  const height = width / 2
  const band = await sharp({ create: { width, height: height / 3, channels: 3, background: '#2f5d50' } }).png().toBuffer()
  return sharp({ create: { width, height, channels: 3, background: '#e8dcc4' } }).composite([{ input: band, left: 0, top: height / 3 }]).png().toBuffer()
}

/** Uploads an image as `kind`, as the form does (`POST /api/uploads?kind=…`). */
async function upload(cookie: string, kind = 'cover', bytes?: Buffer) {
  const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': 'image/png', cookie })
  const body = new Blob([new Uint8Array(bytes ?? (await picture()))])
  const response = await postUpload(new Request(`${TEST_ORIGIN}/api/uploads?kind=${kind}`, { method: 'POST', headers, body }))
  const json = (await response.json()) as { upload: { id: string; width: number; height: number } }
  expect(response.status, JSON.stringify(json)).toBe(201)
  return json.upload
}

const patch = (id: string, body: unknown, cookie?: string) => call(patchListing, { method: 'PATCH', path: `/api/patterns/${id}/listing`, params: { id }, body, cookie })

/** The cover's address as a visitor (or `cookie`'s owner) asks for it: status, type and caching. */
async function fetchCover(id: string, cookie?: string) {
  const headers = new Headers(cookie ? { cookie } : {})
  const response = await readCover(new Request(`${TEST_ORIGIN}/api/shop/covers/${id}`, { headers }), { params: Promise.resolve({ id }) })
  const bytes = new Uint8Array(await response.arrayBuffer())
  return { status: response.status, type: response.headers.get('content-type'), cache: response.headers.get('cache-control'), bytes }
}

describe('skill notes', () => {
  it('are set, trimmed and cleared by the pattern’s designer, and shown in the shop', async () => {
    const { user: designer, cookie } = await person(['designer', 'quilter'], 'Marta Quill')
    const row = await pattern(designer)
    const saved = await patch(row.id, { skillNotes: '  Curved piecing; folded leaves.\nConfident beginners welcome. ' }, cookie)
    expect(saved.status).toBe(200)
    expect(saved.json).toEqual({ listing: { skillNotes: 'Curved piecing; folded leaves.\nConfident beginners welcome.', cover: null } })
    expect((await call(getOne, { params: { id: row.id } })).json?.pattern.skillNotes).toBe('Curved piecing; folded leaves.\nConfident beginners welcome.')
    // What the form reads back.
    expect((await call(readListing, { params: { id: row.id }, cookie })).json?.listing.skillNotes).toBe('Curved piecing; folded leaves.\nConfident beginners welcome.')
    // A field left out stays; an empty one clears.
    expect((await patch(row.id, {}, cookie)).json?.listing.skillNotes).toBe('Curved piecing; folded leaves.\nConfident beginners welcome.')
    expect((await patch(row.id, { skillNotes: '   ' }, cookie)).json?.listing.skillNotes).toBeNull()
  })

  it('longer than the limit are refused with 422 naming skillNotes, and nothing changes', async () => {
    const { user: designer, cookie } = await person(['designer'])
    const row = await pattern(designer)
    await patch(row.id, { skillNotes: 'Short and sweet.' }, cookie)
    const refused = await patch(row.id, { skillNotes: 'x'.repeat(MAX_SKILL_NOTES_LENGTH + 1) }, cookie)
    expect(refused.status).toBe(422)
    expect(refused.json?.error.issues).toEqual([{ path: 'skillNotes', message: `Keep the skill notes to ${MAX_SKILL_NOTES_LENGTH} characters.` }])
    // Exactly at the limit is fine.
    expect((await patch(row.id, { skillNotes: 'y'.repeat(MAX_SKILL_NOTES_LENGTH) }, cookie)).status).toBe(200)
    // An unknown field and a malformed cover id are named too.
    const unknown = await patch(row.id, { skilNotes: 'typo' }, cookie)
    expect(unknown.status).toBe(422)
    expect(JSON.stringify(unknown.json?.error.issues)).toContain('skilNotes')
    const malformed = await patch(row.id, { coverUploadId: 'not-an-id' }, cookie)
    expect(malformed.status).toBe(422)
    expect(malformed.json?.error.issues).toEqual([{ path: 'coverUploadId', message: 'Name an uploaded cover image by its id.' }])
  })
})

describe('who may change the listing', () => {
  it('strangers 401, a tester who sees the pattern 403, another designer 404 (as a missing pattern); admins may', async () => {
    const { user: designer } = await person(['designer'])
    const row = await pattern(designer, 'testing')
    const { user: tester, cookie: testerCookie } = await person(['quilter'])
    await Invitation.create({ patternId: row.id, email: tester.email, invitedById: designer.id, userId: tester.id, acceptedAt: new Date(), withdrawnAt: null, expiresAt: new Date(Date.now() + 7 * 24 * 3600 * 1000) })
    const { cookie: otherCookie } = await person(['designer'])
    const { cookie: adminCookie } = await person(['admin'])

    expect((await patch(row.id, { skillNotes: 'Mine now' })).status).toBe(401)
    const asTester = await patch(row.id, { skillNotes: 'Mine now' }, testerCookie)
    expect(asTester.status).toBe(403)
    expect((await call(readListing, { params: { id: row.id }, cookie: testerCookie })).status).toBe(403)
    expect((await patch(row.id, { skillNotes: 'Mine now' }, otherCookie)).status).toBe(404)
    // The permission step runs before the body is read: a tester's oversized notes are still a 403.
    expect((await patch(row.id, { skillNotes: 'x'.repeat(MAX_SKILL_NOTES_LENGTH + 1) }, testerCookie)).status).toBe(403)
    expect((await patch(row.id, { skillNotes: 'Checked by the desk.' }, adminCookie)).json?.listing.skillNotes).toBe('Checked by the desk.')
    // A body over the form limit is refused first of all, even to a stranger.
    const huge = await call(patchListing, { method: 'PATCH', params: { id: row.id }, rawBody: 'x', headers: { 'content-length': String(64 * 1024) } })
    expect(huge.status).toBe(413)
  })
})

describe('an uploaded cover', () => {
  it('is stored resized, shown in the shop to visitors, and removing it falls back to the drawn ring', async () => {
    const { user: designer, cookie } = await person(['designer'], 'Marta Quill')
    const row = await pattern(designer)
    const cover = await upload(cookie)
    // Stored at the shop's size (2400 × 1200 uploaded), so no page resizes it.
    expect([cover.width, cover.height]).toEqual([MAX_COVER_SIDE, MAX_COVER_SIDE / 2])

    const saved = await patch(row.id, { coverUploadId: cover.id }, cookie)
    expect(saved.status).toBe(200)
    expect(saved.json?.listing.cover).toEqual({ uploadId: cover.id, url: `/api/shop/covers/${cover.id}`, width: MAX_COVER_SIDE, height: MAX_COVER_SIDE / 2 })
    const listed = (await call(listPatterns, { path: '/api/shop/patterns' })).json?.patterns[0]
    expect(listed.coverUrl).toBe(`/api/shop/covers/${cover.id}`)

    // A visitor (not signed in) reads it, and caches may keep it briefly.
    const seen = await fetchCover(cover.id)
    expect(seen.status).toBe(200)
    expect(seen.type).toBe('image/png')
    expect(seen.cache).toBe('public, max-age=300')
    expect((await sharp(seen.bytes).metadata()).width).toBe(MAX_COVER_SIDE)

    // Taken off: the listing has no cover (the shop draws the ring), the image is gone from the
    // store and no longer served.
    const removed = await patch(row.id, { coverUploadId: null }, cookie)
    expect(removed.json?.listing.cover).toBeNull()
    expect((await call(getOne, { params: { id: row.id } })).json?.pattern.coverUrl).toBeNull()
    expect(await Upload.count({ where: { id: cover.id } })).toBe(0)
    expect(await storedKeys()).toEqual([])
    expect((await fetchCover(cover.id)).status).toBe(404)
  })

  it('replacing it removes the old image unless another pattern still shows it', async () => {
    const { user: designer, cookie } = await person(['designer'])
    const [first, second] = [await pattern(designer, 'published', 'First ring'), await pattern(designer, 'published', 'Second ring')]
    const shared = await upload(cookie)
    await patch(first.id, { coverUploadId: shared.id }, cookie)
    await patch(second.id, { coverUploadId: shared.id }, cookie)
    const replacement = await upload(cookie, 'cover', await picture(1200))
    await patch(first.id, { coverUploadId: replacement.id }, cookie)
    // The second ring still shows the shared one.
    expect(await Upload.count({ where: { id: shared.id } })).toBe(1)
    await patch(second.id, { coverUploadId: null }, cookie)
    expect(await Upload.count({ where: { id: shared.id } })).toBe(0)
    expect((await storedKeys()).length).toBe(1)
  })

  it('must be one of your own covers: not another kind of upload, not someone else’s', async () => {
    const { user: designer, cookie } = await person(['designer'])
    const row = await pattern(designer)
    const swatch = await upload(cookie, 'swatch')
    const refusedKind = await patch(row.id, { coverUploadId: swatch.id }, cookie)
    expect(refusedKind.status).toBe(422)
    expect(refusedKind.json?.error.issues[0].path).toBe('coverUploadId')
    const { cookie: otherCookie } = await person(['designer'])
    const theirs = await upload(otherCookie)
    expect((await patch(row.id, { coverUploadId: theirs.id }, cookie)).status).toBe(422)
    expect((await patch(row.id, { coverUploadId: '00000000-0000-4000-8000-000000000000' }, cookie)).status).toBe(422)
  })
})

describe('reading covers', () => {
  it('a visitor reads a listed pattern’s cover, but not a draft’s or a hidden listing’s, nor any other upload', async () => {
    const { user: designer, cookie } = await person(['designer'])
    const published = await pattern(designer, 'published', 'On sale')
    const draft = await pattern(designer, 'draft', 'Still a draft')
    const [publishedCover, draftCover] = [await upload(cookie), await upload(cookie)]
    await patch(published.id, { coverUploadId: publishedCover.id }, cookie)
    await patch(draft.id, { coverUploadId: draftCover.id }, cookie)
    const photo = await upload(cookie, 'fabric-photo')

    expect((await fetchCover(publishedCover.id)).status).toBe(200)
    // The draft's cover: only its owner (not cached by others), never a visitor or another person.
    expect((await fetchCover(draftCover.id)).status).toBe(404)
    expect((await fetchCover(draftCover.id, (await person(['quilter'])).cookie)).status).toBe(404)
    const own = await fetchCover(draftCover.id, cookie)
    expect(own.status).toBe(200)
    expect(own.cache).toBe('private, no-store')
    // Any other upload is not a cover: 404 through this address, even to its owner.
    expect((await fetchCover(photo.id)).status).toBe(404)
    expect((await fetchCover(photo.id, cookie)).status).toBe(404)
    expect((await fetchCover('not-an-id')).status).toBe(404)

    // Hidden by an admin, or retired: private again.
    await published.update({ hiddenAt: new Date() })
    expect((await fetchCover(publishedCover.id)).status).toBe(404)
    await published.update({ hiddenAt: null, state: 'retired' })
    expect((await fetchCover(publishedCover.id)).status).toBe(404)
  })
})
