import 'server-only'
import { Op, Transaction, type WhereOptions } from 'sequelize'
import { authorize, can, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError, ValidationError } from '@/lib/errors'
import { fieldIssues } from '@/lib/http'
import { parseDesign } from '@/lib/schemas/design'
import { patternIdSchema } from '@/lib/schemas/pattern'
import { SHOP_PAGE_SIZE, skillNotesSchema, type ShopListing, type ShopListingPage, type ShopListingQuery, type ShopSort } from '@/lib/schemas/shop-listings'
import { ringCoverSvg } from '@/lib/shop/cover-svg'
import { AdminAuditEntry, Pattern, User } from '@/models'
import { readablePattern } from './patterns'

/**
 * The shop's listings: published patterns that no admin hid, open to everyone (no sign-in), read
 * from the columns kept beside each pattern (never the designs) except to draw a cover the cache
 * does not hold yet. Hiding a listing is an admin's action, recorded in the audit log in the same
 * transaction.
 */

/** What a listing reads of a pattern: no design. */
const LISTING_COLUMNS = [
  'id', 'name', 'ownerId', 'priceCents', 'currency', 'repeats', 'outerDiameterInches', 'colorwaySwatches', 'colourFamilies', 'skillNotes', 'revision', 'publishedAt',
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
  const { rows, count } = await Pattern.findAndCountAll({
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

/**
 * Sets the pattern's skill notes (what it asks of a quilter, shown in the shop), or clears them
 * with null: its designer or an admin, as for any change of the pattern.
 *
 * @example await setSkillNotes(designer, patternId, 'Curved seams; folded leaves.')
 */
export async function setSkillNotes(actor: Actor, id: string, notes: string | null): Promise<void> {
  const parsed = skillNotesSchema.safeParse(notes)
  if (!parsed.success) throw new ValidationError(fieldIssues(parsed.error).map((issue) => ({ ...issue, path: 'skillNotes' })))
  await database().transaction(async (transaction) => {
    const { pattern, facts } = await readablePattern(actor, id, transaction)
    authorize(actor, 'update-pattern', facts)
    await Pattern.update({ skillNotes: parsed.data }, { where: { id: pattern.id }, transaction })
  })
}
