import { z } from 'zod'

/**
 * `POST /api/shop/checkout`: which pattern to buy, nothing more. Not strict on purpose: any other
 * field a client sends (an amount, a price, a currency) is dropped by the parse and never read;
 * the amount charged is the pattern's, read on the server.
 */
export const checkoutSchema = z.object({
  patternId: z.uuid({ error: 'No such pattern in the shop.' }),
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
