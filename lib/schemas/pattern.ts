import { z } from 'zod'
import { designFileSchema } from './design'

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

export const patternNameSchema = z
  .string({ error: 'Give the pattern a name.' })
  .trim()
  .min(1, 'Give the pattern a name.')
  .max(120, 'Keep the name under 120 characters.')

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
