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
  })
  .strict()
  .refine((input) => input.name !== undefined || input.state !== undefined || input.design !== undefined, {
    message: 'Change at least one of name, state or design.',
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
