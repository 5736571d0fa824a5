/**
 * A buyer's booklet built on the server (`POST /api/licences/:id/booklets`, `GET
 * /api/booklets/:id`): the request, in the API's words, made of the booklet's own option schemas
 * (lib/schemas/booklet.ts), and the answers, shared by the library page and the server.
 */
import { z } from 'zod'
import { bookletOptionsSchema, type BookletOptionsInput } from './booklet'

const options = bookletOptionsSchema.shape

/**
 * What a buyer chooses: paper, orientation, colourway (by name; the design's first when left out)
 * and finished diameter in inches (the design's own when left out). Every part of the booklet is
 * built, with the default margins, overlap and cutting settings.
 *
 * @example bookletRequestSchema.parse({ paper: 'a4', diameterIn: 20 }).orientation // 'portrait'
 */
export const bookletRequestSchema = z.strictObject({
  paper: options.paper,
  orientation: options.orientation,
  colorway: options.colorway,
  diameterIn: options.finishedDiameterInches,
})

export type BookletRequest = z.output<typeof bookletRequestSchema>

/**
 * The booklet's own options for a request (what the booklet code and the cache key see).
 *
 * @example bookletOptionsOf({ paper: 'letter', orientation: 'portrait', diameterIn: 18 }) // { paper: 'letter', orientation: 'portrait', finishedDiameterInches: 18 }
 */
export function bookletOptionsOf(request: BookletRequest): BookletOptionsInput {
  return {
    paper: request.paper,
    orientation: request.orientation,
    ...(request.colorway !== undefined ? { colorway: request.colorway } : {}),
    ...(request.diameterIn !== undefined ? { finishedDiameterInches: request.diameterIn } : {}),
  }
}

export const BOOKLET_BUILD_STATES = ['queued', 'building', 'ready', 'failed'] as const

/** `GET /api/booklets/:id` (and `POST`'s answer, with `id`). */
export const bookletStatusSchema = z.object({
  id: z.string(),
  state: z.enum(BOOKLET_BUILD_STATES),
  /** Pages written so far, and the total once known. */
  progress: z.object({ pages: z.number().int(), of: z.number().int().nullable() }).optional(),
  /** The short-lived download link (a path on this site), once ready. */
  url: z.string().optional(),
  /** When the link stops working (ISO time). */
  urlExpiresAt: z.string().optional(),
  /** Why it failed, in words for the buyer. */
  error: z.string().optional(),
  /** While it is queued or building: when to ask again, in milliseconds (askAgainMs). */
  askAgainMs: z.number().int().positive().optional(),
})

/**
 * How long the library page waits, on average, before asking again how a build is going (the
 * server's answer names the wait: askAgainMs). A build being written
 * moves a page every few tenths of a second, so its progress is worth following closely; a queued
 * one waits for the builds ahead of it, and on a sale day every buyer's page asking often would
 * only load the web app that answers them.
 */
export const BOOKLET_ASK_AGAIN_MS = { queued: 2000, building: 700 } as const

/** How far a wait may stray from BOOKLET_ASK_AGAIN_MS either way, as a share of it. */
const ASK_AGAIN_SPREAD = 0.25

/**
 * The wait to tell a page: BOOKLET_ASK_AGAIN_MS of the state, moved at random by up to a quarter
 * either way, so that buyers who asked at the same moment (a sale opening, a newsletter going out)
 * do not all ask again at the same moment, every time.
 *
 * @example askAgainMs('queued', () => 0.5) // 2000
 * @example askAgainMs('building', () => 0) // 525
 */
export function askAgainMs(state: keyof typeof BOOKLET_ASK_AGAIN_MS, random: () => number = Math.random): number {
  const middle = BOOKLET_ASK_AGAIN_MS[state]
  return Math.round(middle * (1 - ASK_AGAIN_SPREAD + 2 * ASK_AGAIN_SPREAD * random()))
}

export type BookletStatus = z.infer<typeof bookletStatusSchema>
