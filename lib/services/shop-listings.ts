import 'server-only'
import { Op, Transaction, type WhereOptions } from 'sequelize'
import { authorize, can, type Actor } from '@/lib/authorization'
import { database, STALE_READ } from '@/lib/db'
import { NotFoundError, ValidationError } from '@/lib/errors'
import { fieldIssues } from '@/lib/http'
import { parseDesign } from '@/lib/schemas/design'
import { coverUrl, type ListingSettings, type ListingSettingsInput } from '@/lib/schemas/listing-settings'
import { patternIdSchema } from '@/lib/schemas/pattern'
import { SHOP_PAGE_SIZE, skillNotesSchema, type ShopListing, type ShopListingPage, type ShopListingQuery, type ShopSort } from '@/lib/schemas/shop-listings'
import { ringCoverSvg } from '@/lib/shop/cover-svg'
import { listingChanges } from '@/lib/shop/listing-changes'
import { AdminAuditEntry, Pattern, Upload, User } from '@/models'
import { readablePattern } from './patterns'
import { forgetUnusedCover, removeStoredObject } from './uploads'

/**
 * The shop's listings: published patterns that no admin hid, open to everyone (no sign-in), read
 * from the columns kept beside each pattern (never the designs) except to draw a cover the cache
 * does not hold yet. Hiding a listing is an admin's action, recorded in the audit log in the same
 * transaction.
 */

/** What a listing reads of a pattern: no design. */
const LISTING_COLUMNS = [
  'id', 'name', 'ownerId', 'priceCents', 'currency', 'repeats', 'outerDiameterInches', 'colorwaySwatches', 'colourFamilies', 'skillNotes', 'coverUploadId', 'revision', 'publishedAt',
] satisfies (keyof Pattern)[]

/** Listed: on sale, priced, and not taken out of the shop by an admin. */
const LISTED: WhereOptions = { state: 'published', hiddenAt: null, priceCents: { [Op.ne]: null } }

type PatternWithOwner = Pattern & { owner?: User | null }

function toListing(pattern: PatternWithOwner): ShopListing {
  return {
    id: pattern.id,
    name: pattern.name,
    designer: pattern.owner?.displayName ?? null,
    priceCents: pattern.priceCents!,
    currency: pattern.currency!,
    repeats: pattern.repeats,
    finishedDiameterIn: pattern.outerDiameterInches,
    colorways: pattern.colorwaySwatches.map(({ name, colours }) => ({ name, colours: [...colours] })),
    colourFamilies: pattern.colourFamilies,
    skillNotes: pattern.skillNotes ?? null,
    coverUrl: pattern.coverUploadId ? coverUrl(pattern.coverUploadId) : null,
    revision: pattern.revision,
    publishedAt: pattern.publishedAt?.toISOString() ?? null,
  }
}

/** `%` and `_` in a search are letters, not wildcards (PostgreSQL's LIKE escapes with a backslash). */
const likeContaining = (search: string) => `%${search.toLowerCase().replace(/[\\%_]/g, (character) => `\\${character}`)}%`

/** Each order of the list, with `id` last so that equal names and prices page in a fixed order. */
function listingOrder(sort: ShopSort): [unknown, string][] {
  const sequelize = database()
  switch (sort) {
    case 'name':
      return [[sequelize.fn('lower', sequelize.col('Pattern.name')), 'ASC'], ['id', 'ASC']]
    // Cents are compared as they stand, whatever the currency: the shop does not convert money.
    case 'price':
      return [['priceCents', 'ASC'], ['id', 'ASC']]
    case '-price':
      return [['priceCents', 'DESC'], ['id', 'ASC']]
    case 'newest':
      // NULLS LAST: a row published by a bulk update (no hook ran) sorts after those with a date.
      return [['publishedAt', 'DESC NULLS LAST'], ['id', 'ASC']]
  }
}

/**
 * A page of the shop: the listed patterns that match the query, in its order.
 *
 * @example await listShopPatterns(shopListingQuerySchema.parse({ q: 'holly', colour: 'greens' })) // { patterns: [{ name: 'Hollyberry Wreath', … }], page: 1, total: 1, … }
 */
export async function listShopPatterns(query: ShopListingQuery): Promise<ShopListingPage> {
  const key = JSON.stringify(query)
  const changes = listingChanges()
  const kept = keptPages.get(key)
  if (kept && kept.changes === changes && kept.until > Date.now()) return kept.page
  const page = readShopPage(query)
  keptPages.delete(key)
  keptPages.set(key, { changes, until: Date.now() + SHOP_PAGE_FRESH_MS, page })
  while (keptPages.size > KEPT_SHOP_PAGES) keptPages.delete(keptPages.keys().next().value!)
  // A failed read is not kept: the next request asks the database again.
  page.catch(() => {
    if (keptPages.get(key)?.page === page) keptPages.delete(key)
  })
  return page
}

/**
 * How long a page of the shop is kept in a web process, in ms. A sale day's visitors ask for the
 * same first page over and over; kept, it costs no statement (`npm run load`, 50 connections: the
 * shop list went from 37 % of the bare handler's requests/s to 91 %). A write through this process to a
 * pattern, a user or an upload drops every kept page at once (lib/shop/listing-changes.ts); a
 * change made through another web instance shows here at most this much later, the same "a moment
 * behind" as a read replica (STALE_READ).
 */
export const SHOP_PAGE_FRESH_MS = 2000
/** Queries kept at most (search words make many; the oldest kept goes first). */
const KEPT_SHOP_PAGES = 200
/** Pages being read or read lately, by query: concurrent asks for one page share one read. */
const keptPages = new Map<string, { changes: number; until: number; page: Promise<ShopListingPage> }>()

async function readShopPage(query: ShopListingQuery): Promise<ShopListingPage> {
  const sequelize = database()
  const conditions: WhereOptions[] = [LISTED]
  const designerName = sequelize.fn('lower', sequelize.col('owner.display_name'))
  if (query.q) {
    conditions.push({
      [Op.or]: [
        sequelize.where(sequelize.fn('lower', sequelize.col('Pattern.name')), Op.like, likeContaining(query.q)),
        sequelize.where(designerName, Op.like, likeContaining(query.q)),
      ],
    })
  }
  if (query.designer) conditions.push(sequelize.where(designerName, Op.like, likeContaining(query.designer)))
  if (query.colour) conditions.push({ colourFamilies: { [Op.contains]: [query.colour] } })
  if (query.repeats !== undefined) conditions.push({ repeats: query.repeats })
  if (query.minPriceCents !== undefined) conditions.push({ priceCents: { [Op.gte]: query.minPriceCents } })
  if (query.maxPriceCents !== undefined) conditions.push({ priceCents: { [Op.lte]: query.maxPriceCents } })
  // The shop's search may be a moment behind (a replica, when DATABASE_READ_URLS names one).
  const { rows, count } = await Pattern.findAndCountAll({
    ...STALE_READ,
    where: { [Op.and]: conditions },
    attributes: LISTING_COLUMNS,
    include: [{ model: User, as: 'owner', attributes: ['displayName'], required: false }],
    // @ts-expect-error Sequelize's OrderItem type does not admit a function call with a direction, which it accepts.
    order: listingOrder(query.sort),
    limit: SHOP_PAGE_SIZE,
    offset: (query.page - 1) * SHOP_PAGE_SIZE,
  })
  return {
    patterns: rows.map((row) => toListing(row as PatternWithOwner)),
    page: query.page,
    pageSize: SHOP_PAGE_SIZE,
    pageCount: Math.max(1, Math.ceil(count / SHOP_PAGE_SIZE)),
    total: count,
  }
}

/**
 * One listed pattern, or a 404 for anything not listed (a draft, a retired or hidden pattern, a
 * malformed id): the shop tells none of these apart. An admin (who may hide listings) also gets
 * a hidden one, marked, so that the page can put it back.
 *
 * @example (await getShopPattern(null, id)).listing.colorways.map((colorway) => colorway.name) // ['Snowberry Dusk', 'Cider Orchard']
 */
export async function getShopPattern(actor: Actor, id: string): Promise<{ listing: ShopListing; hidden: boolean }> {
  database()
  const listed: WhereOptions = can(actor, 'hide-listing') ? { state: 'published', priceCents: { [Op.ne]: null } } : LISTED
  const pattern = patternIdSchema.safeParse(id).success
    ? await Pattern.findOne({
      where: { [Op.and]: [listed, { id }] },
      attributes: [...LISTING_COLUMNS, 'hiddenAt'],
      include: [{ model: User, as: 'owner', attributes: ['displayName'], required: false }],
    })
    : null
  if (!pattern) throw new NotFoundError('No such pattern in the shop.')
  return { listing: toListing(pattern as PatternWithOwner), hidden: pattern.hiddenAt !== null }
}

// Covers: drawn from the design (a few milliseconds each, lib/shop/cover-svg.ts) and kept per
// pattern revision and colourway, so a page of the shop reads designs only for covers it has not
// drawn since the pattern last changed. A new revision is a new key; old ones age out.
const COVER_CACHE_SIZE = 500
const coverCache = new Map<string, string | null>()

const coverKey = (id: string, revision: number, colorway: string) => `${id}@${revision}/${colorway}`

function remember(key: string, svg: string | null): void {
  coverCache.delete(key)
  coverCache.set(key, svg)
  // A Map iterates in insertion order: the first key is the one least recently drawn or read.
  while (coverCache.size > COVER_CACHE_SIZE) coverCache.delete(coverCache.keys().next().value!)
}

/** The cover to draw: a listing (its revision) and one of its colourways by name. */
export interface CoverRequest {
  readonly listing: Pick<ShopListing, 'id' | 'name' | 'revision'>
  readonly colorway: string
}

/**
 * SVG covers of listed patterns, one per request, in the same order; null where the design could
 * not be read (the card then shows no picture). Ids inside each SVG are unique on one page.
 *
 * @example const [svg] = await shopCovers([{ listing, colorway: listing.colorways[0].name }])
 */
export async function shopCovers(requests: readonly CoverRequest[]): Promise<(string | null)[]> {
  const keys = requests.map(({ listing, colorway }) => coverKey(listing.id, listing.revision, colorway))
  const missing = [...new Set(requests.filter((_, index) => !coverCache.has(keys[index]!)).map(({ listing }) => listing.id))]
  if (missing.length > 0) {
    database()
    const patterns = await Pattern.findAll({ where: { id: missing }, attributes: ['id', 'revision', 'design'] })
    const designs = new Map(patterns.map((pattern) => [pattern.id, pattern]))
    requests.forEach(({ listing, colorway }, index) => {
      if (coverCache.has(keys[index]!)) return
      const stored = designs.get(listing.id)
      // The design moved on since the listing was read: draw it next time, under its new revision.
      if (!stored || stored.revision !== listing.revision) return
      const parsed = parseDesign(stored.design)
      const svg = parsed.ok
        ? ringCoverSvg(parsed.design, { colorway, idPrefix: `cover-${listing.id.slice(0, 8)}-${index}`, title: `${listing.name}, colourway ${colorway}` })
        : null
      remember(keys[index]!, svg)
    })
  }
  return keys.map((key) => {
    const svg = coverCache.get(key)
    if (svg !== undefined) remember(key, svg)
    return svg ?? null
  })
}

/**
 * Takes a published pattern's listing out of the shop (`hidden: true`) or puts it back; admins
 * only (404 for others, as every admin-desk action). Its licence holders keep their access. The
 * audit entry is written in the same transaction; a change to what already stands writes none.
 *
 * @example await setListingHidden(admin, patternId, true) // { id, hidden: true }
 */
export async function setListingHidden(actor: Actor, id: string, hidden: boolean): Promise<{ id: string; hidden: boolean }> {
  authorize(actor, 'hide-listing')
  return database().transaction(async (transaction) => {
    const pattern = patternIdSchema.safeParse(id).success
      ? await Pattern.findByPk(id, { attributes: ['id', 'name', 'ownerId', 'hiddenAt', 'state'], transaction, lock: Transaction.LOCK.UPDATE })
      : null
    if (!pattern) throw new NotFoundError('No such pattern.')
    if ((pattern.hiddenAt !== null) === hidden) return { id: pattern.id, hidden }
    const admin = await User.findByPk(actor.id, { attributes: ['id', 'displayName', 'email'], transaction })
    if (!admin) throw new NotFoundError('Your account no longer exists.')
    await Pattern.update({ hiddenAt: hidden ? new Date() : null }, { where: { id: pattern.id }, transaction })
    await AdminAuditEntry.create(
      {
        actorId: admin.id,
        actorLabel: `${admin.displayName} <${admin.email}>`,
        action: hidden ? 'hide-listing' : 'show-listing',
        targetId: pattern.id,
        targetLabel: `pattern “${pattern.name}”`,
        details: { patternId: pattern.id, state: pattern.state },
      },
      { transaction },
    )
    return { id: pattern.id, hidden }
  })
}

// The designer's listing settings: skill notes and the uploaded cover.

/** The settings as the designer's form shows them; the cover's size read from its upload. */
async function listingSettingsOf(pattern: Pattern, transaction?: Transaction): Promise<ListingSettings> {
  const upload = pattern.coverUploadId ? await Upload.findByPk(pattern.coverUploadId, { attributes: ['id', 'width', 'height'], transaction }) : null
  return {
    skillNotes: pattern.skillNotes ?? null,
    cover: upload ? { uploadId: upload.id, url: coverUrl(upload.id), width: upload.width, height: upload.height } : null,
  }
}

/**
 * A pattern's listing settings (skill notes, uploaded cover), for its designer or an admin: 404 to
 * those who may not see the pattern, 403 to those who see it but may not change it.
 *
 * @example await getListingSettings(designer, patternId) // { skillNotes: 'Curved seams.', cover: null }
 */
export async function getListingSettings(actor: Actor, id: string): Promise<ListingSettings> {
  const { pattern, facts } = await readablePattern(actor, id)
  authorize(actor, 'update-pattern', facts)
  return listingSettingsOf(pattern)
}

/**
 * Changes a pattern's listing settings, its designer or an admin (as for any change of the
 * pattern): the skill notes (null clears them) and the cover (an upload of kind `cover` by the
 * person setting it or by the pattern's designer; null takes it off, and the shop draws the ring
 * again). A field left out stays. A cover no pattern shows any more is removed from the store, so
 * that replaced covers do not use up the designer's storage quota.
 *
 * @example await setListingSettings(designer, patternId, { skillNotes: 'Curved seams.', coverUploadId: upload.id })
 */
export async function setListingSettings(actor: Actor, id: string, input: ListingSettingsInput): Promise<ListingSettings> {
  const removed: string[] = []
  const settings = await database().transaction(async (transaction) => {
    const { pattern, facts } = await readablePattern(actor, id, transaction)
    authorize(actor, 'update-pattern', facts)
    const changes: Partial<Pick<Pattern, 'skillNotes' | 'coverUploadId'>> = {}
    if (input.skillNotes !== undefined) changes.skillNotes = input.skillNotes
    if (input.coverUploadId !== undefined && input.coverUploadId !== pattern.coverUploadId) {
      if (input.coverUploadId !== null) {
        const upload = await Upload.findByPk(input.coverUploadId, { attributes: ['id', 'ownerId', 'kind'], transaction })
        const usable = upload && upload.kind === 'cover' && (upload.ownerId === actor.id || upload.ownerId === pattern.ownerId)
        if (!usable) throw new ValidationError([{ path: 'coverUploadId', message: 'No cover image of yours has this id: upload the image as a cover first.' }])
      }
      changes.coverUploadId = input.coverUploadId
    }
    const previousCover = pattern.coverUploadId
    if (Object.keys(changes).length > 0) await pattern.update(changes, { transaction, hooks: false })
    if (changes.coverUploadId !== undefined && previousCover) {
      const key = await forgetUnusedCover(previousCover, transaction)
      if (key) removed.push(key)
    }
    return listingSettingsOf(pattern, transaction)
  })
  // Only once the rows are gone for good: a rolled-back change keeps its image.
  await Promise.all(removed.map(removeStoredObject))
  return settings
}

/**
 * Sets the pattern's skill notes (what it asks of a quilter, shown in the shop), or clears them
 * with null: its designer or an admin, as for any change of the pattern.
 *
 * @example await setSkillNotes(designer, patternId, 'Curved seams; folded leaves.')
 */
export async function setSkillNotes(actor: Actor, id: string, notes: string | null): Promise<void> {
  const parsed = skillNotesSchema.safeParse(notes)
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error).map((issue) => ({ ...issue, path: 'skillNotes' })))
  await setListingSettings(actor, id, { skillNotes: parsed.data })
}
