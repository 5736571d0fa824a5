import { z } from 'zod'
import { MAX_COLORWAYS, MAX_NAME_LENGTH } from '@/lib/limits'
import { text } from './text'

/**
 * `POST /api/shop/checkout { patternId, colorway? }`: which pattern to buy, and the colourway the
 * buyer was looking at — by its name, or by its place in the pattern's list (0 first). A licence
 * covers every colourway; the colourway is recorded on the order for the designer's sales, and the
 * server checks it is one of the pattern's (422 naming `colorway` otherwise). Not strict on
 * purpose: any other field a client sends (an amount, a price, a currency) is dropped by the parse
 * and never read; the amount charged is the pattern's, read on the server.
 *
 * @example checkoutSchema.parse({ patternId: '8c7e0b9a-0c5e-4a4e-9d2b-2f3c4d5e6f70', colorway: 1, amountCents: 1 }) // { patternId: '8c7e0b9a-0c5e-4a4e-9d2b-2f3c4d5e6f70', colorway: 1 }
 */
export const checkoutSchema = z.object({
  patternId: z.uuid({ error: 'No such pattern in the shop.' }),
  colorway: z
    .union([
      z.number().int().min(0).max(MAX_COLORWAYS - 1),
      text({ max: MAX_NAME_LENGTH, messages: { tooLong: 'No colourway has a name that long.' } }),
    ], { error: 'A colourway is named by its name or its place in the list (0 first).' })
    .optional(),
})
export type CheckoutInput = z.infer<typeof checkoutSchema>

/** `POST /api/shop/checkout`'s answer: the provider's hosted payment page. */
export const checkoutAnswerSchema = z.object({ url: z.string(), orderId: z.string() })

/** Where an order stands, as the checkout result page polls it (`GET /api/shop/orders/:id`). */
export const orderStatusSchema = z.object({
  id: z.string(),
  state: z.enum(['pending', 'paid', 'refunded']),
  patternName: z.string(),
  amountCents: z.number().int(),
  currency: z.string(),
  /** The licence once a verified payment granted it. */
  licence: z.object({ id: z.string(), number: z.string(), revoked: z.boolean() }).nullable(),
})
export type OrderStatus = z.infer<typeof orderStatusSchema>

/** One licence in the buyer's library (`GET /api/library`). */
export const libraryEntrySchema = z.object({
  id: z.string(),
  number: z.string(),
  patternId: z.string(),
  patternName: z.string(),
  designer: z.string(),
  grantedAt: z.string(),
  /** Whether the pattern is still sold; a retired one stays printable for its licence holders. */
  patternState: z.enum(['published', 'retired']),
})
export type LibraryEntry = z.infer<typeof libraryEntrySchema>
export const libraryAnswerSchema = z.object({ licences: z.array(libraryEntrySchema) })
