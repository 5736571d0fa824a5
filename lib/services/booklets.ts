import 'server-only'
import { createHash, randomUUID } from 'node:crypto'
import { hostname } from 'node:os'
import { QueryTypes } from 'sequelize'
import { authorize, type Actor, type BookletFacts } from '@/lib/authorization'
import type { FooterNotice } from '@/lib/booklet/chrome'
import { signDownloadToken, linkSecret, verifyDownloadToken } from '@/lib/booklets/download-token'
import { database } from '@/lib/db'
import { bookletSettings } from '@/lib/env'
import { ForbiddenError, NotFoundError, ValidationError } from '@/lib/errors'
import { BOOKLETS_QUEUE, queueJob } from '@/lib/jobs/queue'
import { getObject, objectKey, putObject } from '@/lib/object-store'
import { countBookletBuild } from '@/lib/rate-limits'
import { bookletOptionsSchema, type BookletOptionsInput } from '@/lib/schemas/booklet'
import { askAgainMs, bookletOptionsOf, type BookletRequest, type BookletStatus } from '@/lib/schemas/booklet-builds'
import { parseDesign } from '@/lib/schemas/design'
import type { Design } from '@/geometry'
import { BookletBuild, Licence, Pattern, PatternRevision, User } from '@/models'

/**
 * Buyers' booklets built on the server (issue 14): a licence holder asks for one with their paper,
 * orientation, colourway and size; the build is queued ('booklets', lib/jobs/queue.ts) and written
 * by the booklet worker process (scripts/booklet-worker.ts), never by the web process, with the
 * buyer's name and licence number at the foot of every page; the PDF goes to the object store and
 * is handed out through a short-lived signed link whose route asks the rules again. Asking again
 * for the same booklet (same pattern revision, options, licence and name) is answered by the build
 * already queued, building or stored.
 */

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i

/** What a buyer reads when a build gives up; the real error goes to the worker's log only. */
const BUILD_FAILED = 'The booklet could not be built. Try again in a while, or with other options.'

/** A build with the rows the rules ask about. */
interface LoadedBuild {
  build: BookletBuild
  facts: BookletFacts
}

function factsOf(requesterId: string, licence: Licence, pattern: Pattern): BookletFacts {
  return {
    requesterId,
    licenceHolderId: licence.userId,
    licenceRevoked: licence.revokedAt !== null,
    // The licence itself is the holder's fact: live and theirs, or nothing.
    pattern: { ownerId: pattern.ownerId, state: pattern.state, licenceHolderIds: licence.revokedAt === null ? [licence.userId] : [] },
  }
}

/**
 * A build, for someone the rules let see it; 404 for anyone else, exactly like a missing one. One
 * query with its licence and the pattern's owner and state: the library page asks this every
 * second or so while a booklet builds, for each buyer at once on a sale day.
 */
async function loadBuild(actor: Actor, buildId: string): Promise<LoadedBuild> {
  authorize(actor, 'read-own-library')
  database()
  const build = UUID.test(buildId)
    ? await BookletBuild.findByPk(buildId, {
        include: [{ model: Licence, as: 'licence', required: true, include: [{ model: Pattern, as: 'pattern', attributes: ['id', 'ownerId', 'state'], required: true }] }],
      })
    : null
  const licence = build?.licence
  const pattern = licence?.pattern
  if (!build || !licence || !pattern) throw new NotFoundError('No such booklet.')
  const facts = factsOf(build.userId, licence, pattern)
  authorize(actor, 'get-licensed-booklet', facts)
  return { build, facts }
}

/**
 * The cache key of a booklet: everything its bytes depend on.
 *
 * @example cacheKeyOf({ patternId: 'p', revision: 3, options: { paper: 'a4' }, licenceId: 'l', userId: 'u', person: 'Elsie Varga' }).length // 64
 */
export function cacheKeyOf(parts: { patternId: string; revision: number; options: BookletOptionsInput; licenceId: string; userId: string; person: string }): string {
  // Defaults filled in, in the schema's order, so that `{ paper }` and `{ paper, orientation: 'portrait' }` are one booklet.
  const options = bookletOptionsSchema.parse(parts.options)
  return createHash('sha256')
    .update(JSON.stringify(['booklet-v1', parts.patternId, parts.revision, options, parts.licenceId, parts.userId, parts.person]))
    .digest('hex')
}

/** The answer for a build, with a fresh download link once it is ready. */
function statusOf(build: BookletBuild, userId: string): BookletStatus {
  const status: BookletStatus = { id: build.id, state: build.state }
  if (build.state === 'queued' || build.state === 'building') {
    status.progress = { pages: build.pagesDone, of: build.pageCount }
    status.askAgainMs = askAgainMs(build.state === 'queued' ? 'queued' : 'building')
  }
  if (build.state === 'ready') {
    const settings = bookletSettings()
    const expiresAt = Math.floor(Date.now() / 1000) + settings.linkSeconds
    const token = signDownloadToken({ buildId: build.id, userId, expiresAt }, linkSecret(settings.linkSecret))
    status.progress = { pages: build.pageCount ?? build.pagesDone, of: build.pageCount }
    status.url = `/api/booklets/${build.id}/download?token=${encodeURIComponent(token)}`
    status.urlExpiresAt = new Date(expiresAt * 1000).toISOString()
  }
  if (build.state === 'failed') status.error = build.error ?? BUILD_FAILED
  return status
}

/** Who asks for a booklet: the signed-in person, whose name goes in every page footer. */
export type BookletAsker = NonNullable<Actor> & { readonly displayName: string }

/** A licence and its pattern, loaded for the person asking for a booklet. */
export interface LicenceForBooklet {
  readonly licence: Licence
  readonly pattern: Pattern
}

/**
 * The permission step of `POST /api/licences/:id/booklets`: the licence and its pattern, when the
 * person holds it live; 404 for anyone else, a revoked licence and a missing one alike.
 */
export async function licenceForBooklet(actor: Actor, licenceId: string): Promise<LicenceForBooklet> {
  authorize(actor, 'read-own-library')
  database()
  const licence = UUID.test(licenceId) ? await Licence.findByPk(licenceId, { include: [{ model: Pattern, as: 'pattern', required: true }] }) : null
  const pattern = licence?.pattern
  if (!licence || !pattern) throw new NotFoundError('No such licence in your library.')
  authorize(actor, 'get-licensed-booklet', factsOf(actor.id, licence, pattern))
  return { licence, pattern }
}

/**
 * Asks for a booklet of a licence's pattern (`POST /api/licences/:id/booklets`): only the holder
 * of the live licence; the colourway must be one of the design's. Counted against the person's
 * booklet limit. The same booklet asked for again is the build already there.
 *
 * @example const { id, state } = await requestBooklet(user, await licenceForBooklet(user, licenceId), { paper: 'letter', orientation: 'portrait' })
 */
export async function requestBooklet(actor: BookletAsker, licensed: LicenceForBooklet, request: BookletRequest): Promise<BookletStatus> {
  authorize(actor, 'read-own-library')
  authorize(actor, 'get-licensed-booklet', factsOf(actor.id, licensed.licence, licensed.pattern))
  const sequelize = database()
  const { licence, pattern } = licensed
  await countBookletBuild(actor.id)
  // The names straight from the stored file: parsing the whole design is the worker's work, kept
  // out of the web process (an unreadable design fails the build with a plain message).
  const colorwayNames = ((pattern.design as { colorways?: { name?: unknown }[] } | null)?.colorways ?? []).map((colorway) => colorway.name)
  if (request.colorway !== undefined && !colorwayNames.includes(request.colorway)) {
    throw new ValidationError([{ path: 'colorway', message: `This pattern has no colourway named “${request.colorway}”.` }])
  }
  const options = bookletOptionsOf(request)
  const cacheKey = cacheKeyOf({ patternId: pattern.id, revision: pattern.revision, options, licenceId: licence.id, userId: actor.id, person: actor.displayName })
  // A new build and its job are one transaction. The same booklet asked for twice at once makes one
  // build: the second insert meets the unique index of live builds and takes the first one's row.
  const created = await sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<BookletBuild>(
      `INSERT INTO booklet_builds (id, licence_id, user_id, pattern_id, pattern_revision, options, cache_key)
       VALUES (:id, :licenceId, :userId, :patternId, :revision, :options, :cacheKey)
       ON CONFLICT (cache_key) WHERE state <> 'failed' DO NOTHING
       RETURNING *`,
      {
        replacements: { id: randomUUID(), licenceId: licence.id, userId: actor.id, patternId: pattern.id, revision: pattern.revision, options: JSON.stringify(options), cacheKey },
        type: QueryTypes.SELECT,
        model: BookletBuild,
        mapToModel: true,
        transaction,
      },
    )
    if (row) await queueJob(BOOKLETS_QUEUE, { buildId: row.id }, transaction)
    return row
  })
  const build = created ?? (await BookletBuild.findOne({ where: { cacheKey, state: ['queued', 'building', 'ready'] } }))
  if (!build) throw new Error(`the booklet build for key ${cacheKey} is neither new nor live`)
  return statusOf(build, actor.id)
}

/** Where a build is (`GET /api/booklets/:id`), for the person who asked for it while they hold the licence. */
export async function bookletStatus(actor: Actor, buildId: string): Promise<BookletStatus> {
  const { build } = await loadBuild(actor, buildId)
  return statusOf(build, actor!.id)
}

/**
 * The stored PDF behind a download link (`GET /api/booklets/:id/download?token=…`): the rules
 * first (anyone but the holder: 404), then the token, which must be this build's, this person's,
 * and unexpired (otherwise 403, "get a new link").
 */
export async function openBookletDownload(actor: Actor, buildId: string, token: string | null): Promise<{ body: ReadableStream<Uint8Array>; length: number | undefined; fileName: string }> {
  const { build } = await loadBuild(actor, buildId)
  const settings = bookletSettings()
  const grant = token ? verifyDownloadToken(token, linkSecret(settings.linkSecret), Math.floor(Date.now() / 1000)) : null
  if (!grant || grant.buildId !== build.id || grant.userId !== actor!.id) {
    throw new ForbiddenError('This download link has expired or is not valid. Open your library to get a new one.')
  }
  if (build.state !== 'ready' || !build.objectKey) throw new NotFoundError('This booklet is not ready yet.')
  const stored = await getObject(build.objectKey)
  if (!stored) throw new NotFoundError('This booklet is no longer stored. Ask for it again from your library.')
  const pattern = await Pattern.findByPk(build.patternId, { attributes: ['name'] })
  const slug = (pattern?.name ?? 'booklet').toLowerCase().replace(/[^a-z0-9]+/g, '-').replace(/^-|-$/g, '') || 'booklet'
  return { ...stored, fileName: `${slug}-${build.options.paper as string}.pdf` }
}

/** The design of a pattern at a revision (the revision row, or the pattern's own at its current one). */
async function designAt(pattern: Pattern, revision: number): Promise<Design> {
  const row = await PatternRevision.findOne({ where: { patternId: pattern.id, revision }, attributes: ['design'] })
  const stored = row?.design ?? (pattern.revision === revision ? pattern.design : null)
  const parsed = stored ? parseDesign(stored) : null
  if (!parsed?.ok) throw new Error(`the design of pattern ${pattern.id} at revision ${revision} is missing or unreadable`)
  return parsed.design
}

/** What the worker hands a build to: writes the PDF, calling `onPage` as each page is begun. */
export type WriteBooklet = (request: { design: Design; options: BookletOptionsInput; footer: FooterNotice }, onPage: (page: number) => void) => Promise<{ bytes: Uint8Array; pageCount: number }>

/** Makes the buyer's footer for the build's options (lib/booklets/footer.ts). */
export type FooterFor = (person: string, licenceNumber: string, options: BookletOptionsInput) => FooterNotice

/**
 * Builds one queued booklet (the booklet worker, for a job of the 'booklets' queue): marks it
 * building, writes it with progress per page, stores the PDF under `booklets/<id>.pdf` and marks
 * it ready. A build already ready is left alone (a job delivered twice); one whose licence was
 * revoked meanwhile fails at once. On an error it is queued again while the queue will retry
 * (`lastTry` false) and marked failed with a plain message on the last try; the error is rethrown
 * for the queue.
 */
export async function runBookletBuild(buildId: string, tools: { write: WriteBooklet; footerFor: FooterFor; lastTry: boolean }): Promise<void> {
  database()
  const build = await BookletBuild.findByPk(buildId)
  if (!build || build.state === 'ready' || build.state === 'failed') return
  const licence = await Licence.findByPk(build.licenceId)
  const pattern = await Pattern.findByPk(build.patternId)
  if (!licence || !pattern || licence.revokedAt !== null) {
    await build.update({ state: 'failed', error: 'The licence behind this booklet is no longer valid.', finishedAt: new Date() })
    return
  }
  await build.update({ state: 'building', startedAt: new Date(), attempts: build.attempts + 1, builtBy: `${hostname()}:${process.pid}`, pagesDone: 0, error: null })
  // Progress is written page by page, one update at a time; pages begun meanwhile are folded into the next.
  let written = 0
  let saving: Promise<unknown> = Promise.resolve()
  let pending = false
  const onPage = (page: number) => {
    written = page
    if (pending) return
    pending = true
    saving = saving.then(async () => {
      pending = false
      await BookletBuild.update({ pagesDone: written }, { where: { id: build.id, state: 'building' } })
    })
  }
  try {
    const design = await designAt(pattern, build.patternRevision)
    const person = (await User.findByPk(build.userId, { attributes: ['displayName'] }))?.displayName ?? 'the licence holder'
    const options = build.options as BookletOptionsInput
    const footer = tools.footerFor(person, licence.number, options)
    const pdf = await tools.write({ design, options, footer }, onPage)
    await saving
    const key = objectKey(`booklets/${build.id}.pdf`)
    await putObject(key, pdf.bytes, 'application/pdf')
    await build.update({ state: 'ready', objectKey: key, pageCount: pdf.pageCount, pagesDone: pdf.pageCount, byteSize: pdf.bytes.byteLength, finishedAt: new Date() })
  } catch (error) {
    await saving.catch(() => undefined)
    await build.update(tools.lastTry ? { state: 'failed', error: BUILD_FAILED, finishedAt: new Date() } : { state: 'queued', error: 'Trying again…' })
    throw error
  }
}
