import { z } from 'zod'
import { skillNotesSchema } from './shop-listings'

/**
 * The designer's settings of a pattern's listing in the shop: its skill notes and its uploaded
 * cover. `PATCH /api/patterns/:id/listing` and the form on the pattern's page parse with the same
 * schema. A field left out stays as it is; `skillNotes: ''` or `null` clears the notes,
 * `coverUploadId: null` takes the cover off (the shop then draws the ring).
 */
export const listingSettingsSchema = z
  .object({
    skillNotes: skillNotesSchema.optional(),
    /** An upload of kind `cover` (`POST /api/uploads?kind=cover`), the designer's own. */
    coverUploadId: z.uuid({ error: 'Name an uploaded cover image by its id.' }).nullable().optional(),
  })
  .strict()
export type ListingSettingsInput = z.infer<typeof listingSettingsSchema>

/** The cover as the settings answer with it: the address that serves it and its stored size. */
const listingCoverSchema = z.object({
  uploadId: z.string(),
  url: z.string(),
  width: z.number().int().positive(),
  height: z.number().int().positive(),
})

/** `GET` and `PATCH /api/patterns/:id/listing` → `{ listing: { skillNotes, cover } }`. */
const listingSettingsViewSchema = z.object({
  skillNotes: z.string().nullable(),
  cover: listingCoverSchema.nullable(),
})
export type ListingSettings = z.infer<typeof listingSettingsViewSchema>

export const listingSettingsAnswerSchema = z.object({ listing: listingSettingsViewSchema })

/**
 * Where a cover is served: `GET /api/shop/covers/:id`, to everyone while its pattern is listed.
 *
 * @example coverUrl('0b6c2f0e-3f1a-4c55-9d1e-2a7b9c1d0e4f') // '/api/shop/covers/0b6c2f0e-3f1a-4c55-9d1e-2a7b9c1d0e4f'
 */
export function coverUrl(uploadId: string): string {
  return `/api/shop/covers/${uploadId}`
}
