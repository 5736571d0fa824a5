import { z } from 'zod'
import { MAX_NAME_LENGTH } from '@/lib/limits'
import { designFileSchema } from './design'
import { text } from './text'

/** A pattern's life: drafted, sewn by testers, sold, withdrawn. */
export const PATTERN_STATES = ['draft', 'testing', 'published', 'retired'] as const
export type PatternState = (typeof PATTERN_STATES)[number]

/** Which state may follow which (a published pattern is retired, not sent back to draft). */
export const PATTERN_STATE_CHANGES: Readonly<Record<PatternState, readonly PatternState[]>> = {
  draft: ['testing'],
  testing: ['draft', 'published'],
  published: ['retired'],
  retired: ['published'],
}

/**
 * The currencies a pattern may be priced in: ISO 4217 codes, a short list of our choosing (the
 * currencies most of our designers and buyers use); more can be added here.
 */
export const PATTERN_CURRENCIES = ['USD', 'EUR', 'GBP', 'CAD', 'AUD'] as const
export type PatternCurrency = (typeof PATTERN_CURRENCIES)[number]

/** The highest price a pattern may ask: 1,000.00 in its currency (our choice: a pattern, not a quilt). */
export const MAX_PRICE_CENTS = 100_000

/** A pattern's price: integer cents above zero and a currency; `null` clears it. */
export const patternPriceSchema = z
  .object({
    priceCents: z
      .number({ error: 'Give the price in cents, a whole number.' })
      .int('Give the price in cents, a whole number.')
      .positive('The price must be above zero.')
      .max(MAX_PRICE_CENTS, `Keep the price to ${MAX_PRICE_CENTS / 100} or less.`),
    currency: z.enum(PATTERN_CURRENCIES, { error: `Choose one of ${PATTERN_CURRENCIES.join(', ')}.` }),
  })
  .strict()

export const patternNameSchema = text({
  max: MAX_NAME_LENGTH,
  messages: { required: 'Give the pattern a name.', empty: 'Give the pattern a name.', tooLong: `Keep the name to ${MAX_NAME_LENGTH} characters.` },
})

export const createPatternSchema = z
  .object({
    name: patternNameSchema,
    /** Optional: a new pattern starts as an empty ring of quarters. */
    design: designFileSchema.optional(),
  })
  .strict()
export type CreatePatternInput = z.infer<typeof createPatternSchema>

export const updatePatternSchema = z
  .object({
    /** The revision the client last saw; a save from an older one is refused with 409. */
    revision: z.number({ error: 'Say which revision this change starts from.' }).int().positive(),
    name: patternNameSchema.optional(),
    state: z.enum(PATTERN_STATES).optional(),
    design: designFileSchema.optional(),
    /** The price (publishing needs one); `null` takes it away (not while the pattern is published). */
    price: patternPriceSchema.nullable().optional(),
  })
  .strict()
  .refine((input) => input.name !== undefined || input.state !== undefined || input.design !== undefined || input.price !== undefined, {
    message: 'Change at least one of name, state, design or price.',
    path: ['name'],
  })
export type UpdatePatternInput = z.infer<typeof updatePatternSchema>

export const patternIdSchema = z.uuid({ error: 'No such pattern.' })

// The API's answers, parsed by the browser (lib/api-client.ts) and typed on the server
// (lib/services/patterns.ts) from the same schemas. Plain objects, not strict: an answer that
// gains a field does not break an older page.

/** A row of the pattern shelf, as `GET /api/patterns` lists it. */
export const patternSummarySchema = z.object({
  id: z.string(),
  name: z.string(),
  state: z.enum(PATTERN_STATES),
  revision: z.number().int().positive(),
  /** The design's summary, kept beside it (lib/design-summary.ts): what the shelf shows of it. */
  repeats: z.number(),
  outerDiameterInches: z.number(),
  seamCount: z.number(),
  /** Both null until the designer sets a price. */
  priceCents: z.number().int().nullable().optional(),
  currency: z.enum(PATTERN_CURRENCIES).nullable().optional(),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type PatternSummary = z.infer<typeof patternSummarySchema>

/** One pattern with its design, as `GET`, `POST` and `PATCH` answer it. */
export const patternViewSchema = patternSummarySchema.extend({ ownerId: z.string(), design: designFileSchema })
export type PatternView = z.infer<typeof patternViewSchema>

/** `GET /api/patterns`. */
export const patternListAnswerSchema = z.object({ patterns: z.array(patternSummarySchema) })
/** `GET`, `PATCH /api/patterns/:id` and `POST /api/patterns`. */
export const patternAnswerSchema = z.object({ pattern: patternViewSchema })
