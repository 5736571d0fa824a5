import { z } from 'zod'

/** What an upload is for, as the upload address names it (`?kind=`). */
export const uploadPurposeSchema = z.enum(['fabric-photo', 'swatch', 'report-photo', 'cover'], {
  error: 'Say what the image is for: kind=fabric-photo, kind=swatch, kind=report-photo or kind=cover.',
})

/** An upload as the API answers it; `url` serves the image to its owner. */
export const uploadViewSchema = z.object({
  id: z.string(),
  kind: z.enum(['fabric-photo', 'swatch', 'cover', 'report-photo']),
  contentType: z.enum(['image/jpeg', 'image/png', 'image/webp']),
  width: z.number().int().positive(),
  height: z.number().int().positive(),
  bytes: z.number().int().positive(),
  /** `#rrggbb` colours proposed from a theme-fabric photo; null for other kinds. */
  palette: z.array(z.string().regex(/^#[0-9a-f]{6}$/)).nullable(),
  url: z.string(),
  createdAt: z.string(),
})
export type UploadView = z.infer<typeof uploadViewSchema>

export const uploadAnswerSchema = z.object({ upload: uploadViewSchema })
export const uploadListAnswerSchema = z.object({ uploads: z.array(uploadViewSchema) })
