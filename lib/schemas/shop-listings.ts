import { z } from 'zod'
import type { FieldIssue } from '@/lib/errors'
import { MAX_REPEATS, MAX_SKILL_NOTES_LENGTH, MIN_REPEATS } from '@/lib/limits'
import { COLOUR_FAMILIES } from '@/lib/shop/colour-families'
import { MAX_PRICE_CENTS, PATTERN_CURRENCIES } from './pattern'
import { text } from './text'

/**
 * The shop's inputs and answers: the listing's query string (`GET /api/shop/patterns` and the
 * /shop page read it with the same schema, so the page's form works without JavaScript), the
 * admin's hide switch, and the listing rows the API answers with.
 */

/** Cards per page: four rows of three on a wide screen. */
export const SHOP_PAGE_SIZE = 12

/** How the list can be ordered: newest on sale first (the default), by name, by price up or down. */
export const SHOP_SORTS = ['newest', 'name', 'price', '-price'] as const
export type ShopSort = (typeof SHOP_SORTS)[number]

/** The fewest and most repeats a ring may have (the design schema's rule, geometry's Ring). */

/** An empty field of the page's form (`?colour=`) means "any", as if it were not sent. */
const blankAsAbsent = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : value)

const wholeNumber = (message: string, min: number, max: number) =>
  z.preprocess(blankAsAbsent, z.coerce.number({ error: message }).int(message).min(min, message).max(max, message).optional())

const priceCents = wholeNumber(`A price in cents is a whole number from 0 to ${MAX_PRICE_CENTS}.`, 0, MAX_PRICE_CENTS)

/**
 * `GET /api/shop/patterns?q=&designer=&colour=&repeats=&minPriceCents=&maxPriceCents=&sort=&page=`:
 * `q` is found in a pattern's name or its designer's name, `designer` in the designer's name (any
 * letter case, `%` and `_` as plain letters); `colour` is a colour family; the price range is in
 * cents, both ends included. A parameter the shop does not know is refused (422 naming it), so a
 * misspelt filter is not silently ignored.
 */
export const shopListingQuerySchema = z
  .object({
    q: z.preprocess(blankAsAbsent, text({ max: 100, min: 0 }).optional()),
    designer: z.preprocess(blankAsAbsent, text({ max: 100, min: 0 }).optional()),
    colour: z.preprocess(blankAsAbsent, z.enum(COLOUR_FAMILIES, { error: `A colour is one of ${COLOUR_FAMILIES.join(', ')}.` }).optional()),
    repeats: wholeNumber(`Repeats are a whole number from ${MIN_REPEATS} to ${MAX_REPEATS}.`, MIN_REPEATS, MAX_REPEATS),
    minPriceCents: priceCents,
    maxPriceCents: priceCents,
    sort: z.preprocess(blankAsAbsent, z.enum(SHOP_SORTS, { error: `Sort by one of ${SHOP_SORTS.join(', ')}.` }).default('newest')),
    page: z.preprocess(
      blankAsAbsent,
      z.coerce.number({ error: 'A page is a whole number from 1.' }).int('A page is a whole number from 1.').min(1, 'A page is a whole number from 1.').max(10_000, 'There are not that many pages.').default(1),
    ),
  })
  .strict()
  .refine((query) => query.minPriceCents === undefined || query.maxPriceCents === undefined || query.minPriceCents <= query.maxPriceCents, {
    message: 'The highest price must not be below the lowest.',
    path: ['maxPriceCents'],
  })
export type ShopListingQuery = z.infer<typeof shopListingQuerySchema>

/**
 * Reads a query string (the API's, or the page's `searchParams`) with the listing schema. A
 * repeated parameter keeps its first value; each refusal names its parameter — an unknown one
 * too, by its own name rather than the whole query's.
 *
 * @example readShopQuery({ colour: 'mauve' }) // { ok: false, issues: [{ path: 'colour', message: 'A colour is one of reds, …' }] }
 */
export function readShopQuery(
  parameters: URLSearchParams | Readonly<Record<string, string | readonly string[] | undefined>>,
): { ok: true; query: ShopListingQuery } | { ok: false; issues: FieldIssue[] } {
  const object: Record<string, string> = {}
  const entries = parameters instanceof URLSearchParams ? [...parameters] : Object.entries(parameters)
  for (const [name, value] of entries) {
    const first = typeof value === 'string' ? value : value?.[0]
    if (first !== undefined && !(name in object)) object[name] = first
  }
  const parsed = shopListingQuerySchema.safeParse(object)
  if (parsed.success) return { ok: true, query: parsed.data }
  return {
    ok: false,
    issues: parsed.error.issues.flatMap((issue) =>
      issue.code === 'unrecognized_keys'
        ? issue.keys.map((key) => ({ path: key, message: `The shop has no filter called “${key}”.` }))
        : [{ path: issue.path.map(String).join('.') || '(query)', message: issue.message }],
    ),
  }
}

/** `PATCH /api/admin/listings/:id { hidden }`: take a listing out of the shop, or put it back. */
export const listingVisibilitySchema = z.object({ hidden: z.boolean({ error: 'Say true or false.' }) }).strict()

/** A pattern's skill notes: a paragraph or two, line breaks kept; empty or null clears them. */
export const skillNotesSchema = z.preprocess(
  blankAsAbsent,
  text({ max: MAX_SKILL_NOTES_LENGTH, multiline: true, messages: { tooLong: `Keep the skill notes to ${MAX_SKILL_NOTES_LENGTH} characters.` } }).nullable().optional(),
).transform((notes) => notes ?? null)

/** A colourway on a card: its name and its fabrics' colours. */
const colorwaySwatchesSchema = z.object({ name: z.string(), colours: z.array(z.string()) })

/** One listed pattern, as `GET /api/shop/patterns` answers it (plain, not strict: a new field breaks no page). */
export const shopListingSchema = z.object({
  id: z.string(),
  name: z.string(),
  /** The designer's display name; null when they deleted their account (the pattern stays on sale). */
  designer: z.string().nullable(),
  priceCents: z.number().int(),
  currency: z.enum(PATTERN_CURRENCIES),
  repeats: z.number().int(),
  /** The ring's finished outer diameter as designed, inches (the print room prints it at any size). */
  finishedDiameterIn: z.number(),
  colorways: z.array(colorwaySwatchesSchema),
  colourFamilies: z.array(z.enum(COLOUR_FAMILIES)),
  skillNotes: z.string().nullable(),
  /** The designer's uploaded cover (`GET /api/shop/covers/:id`, open to everyone); null: the ring drawn from the design is the cover. */
  coverUrl: z.string().nullable(),
  /** The design's revision: covers are drawn (and cached) per revision and colourway. */
  revision: z.number().int(),
  publishedAt: z.string().nullable(),
})
export type ShopListing = z.infer<typeof shopListingSchema>

export const shopListingPageSchema = z.object({
  patterns: z.array(shopListingSchema),
  page: z.number().int(),
  pageSize: z.number().int(),
  pageCount: z.number().int(),
  total: z.number().int(),
})
export type ShopListingPage = z.infer<typeof shopListingPageSchema>
