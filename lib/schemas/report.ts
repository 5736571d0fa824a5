import { z } from 'zod'
import { text } from './text'

/**
 * Test reports: what a tester who sewed a pattern from its booklet tells its designer, pointed at a
 * place the pattern knows (an area label, a sewing step, a booklet page or a point on the board).
 * One schema per input, shared by the forms and the server; the answers' shapes below them.
 */

/** What went wrong, a closed list of our own. */
export const REPORT_KINDS = ['fit', 'cutting', 'printing', 'instructions', 'other'] as const
export type ReportKind = (typeof REPORT_KINDS)[number]
export const REPORT_KIND_NAMES: Readonly<Record<ReportKind, string>> = {
  fit: 'Pieces do not fit',
  cutting: 'Cutting',
  printing: 'Printing',
  instructions: 'Instructions',
  other: 'Something else',
}

/** How much it matters to the person sewing, least first. */
export const REPORT_SEVERITIES = ['minor', 'needs-fixing', 'blocks-sewing'] as const
export type ReportSeverity = (typeof REPORT_SEVERITIES)[number]
export const REPORT_SEVERITY_NAMES: Readonly<Record<ReportSeverity, string>> = {
  minor: 'Minor',
  'needs-fixing': 'Needs fixing',
  'blocks-sewing': 'Blocks sewing',
}

export const REPORT_STATES = ['open', 'resolved'] as const
export type ReportState = (typeof REPORT_STATES)[number]

/** Longest report or answer, in characters. */
export const MAX_REPORT_TEXT = 4000
/** Most photos on one report. */
export const MAX_REPORT_PHOTOS = 6
/** A point on the board lies within this many inches of the ring's centre (the design schema's largest ring is far smaller). */
const MAX_POINT_INCHES = 500

const reportText = text({
  max: MAX_REPORT_TEXT,
  multiline: true,
  messages: { required: 'Say what happened.', empty: 'Say what happened.', tooLong: `Keep it to ${MAX_REPORT_TEXT} characters.` },
})

const coordinate = z
  .number({ error: 'A point is two numbers, in inches.' })
  .refine(Number.isFinite, 'A point is two finite numbers, in inches.')
  .refine((value) => Math.abs(value) <= MAX_POINT_INCHES, `A point lies within ${MAX_POINT_INCHES} in of the centre.`)

/**
 * Where on the pattern: at least one of an area label as the plan names it ("A3"), a step of the
 * sewing order (1 = the first area sewn), a page of the printed booklet, or a point on the board
 * in the design's inches (the ring's frame, y up).
 */
export const reportPlaceSchema = z
  .object({
    area: z
      .string({ error: 'An area is named by its label, such as A3.' })
      .trim()
      .toUpperCase()
      .regex(/^[A-Z]{1,3}[1-9][0-9]{0,3}$/, 'An area is named by its label, such as A3.')
      .optional(),
    step: z.number({ error: 'A step is a whole number from 1.' }).int('A step is a whole number from 1.').min(1, 'A step is a whole number from 1.').max(10_000).optional(),
    page: z.number({ error: 'A page is a whole number from 1.' }).int('A page is a whole number from 1.').min(1, 'A page is a whole number from 1.').max(2_000).optional(),
    point: z.tuple([coordinate, coordinate], { error: 'A point is two numbers, in inches: [x, y].' }).optional(),
  })
  .strict()
  .refine((place) => place.area !== undefined || place.step !== undefined || place.page !== undefined || place.point !== undefined, {
    message: 'Say where: an area, a step, a page or a point on the board.',
    path: ['area'],
  })
export type ReportPlace = z.infer<typeof reportPlaceSchema>

/**
 * The place in words, for messages and the table.
 *
 * @example placeInWords({ area: 'A3', page: 2 }) // 'area A3, page 2'
 */
export function placeInWords(place: { readonly area?: string; readonly step?: number; readonly page?: number; readonly point?: readonly number[] }): string {
  const parts: string[] = []
  if (place.area) parts.push(`area ${place.area}`)
  if (place.step !== undefined) parts.push(`step ${place.step}`)
  if (place.page !== undefined) parts.push(`page ${place.page}`)
  if (place.point && parts.length === 0) parts.push('a point on the board')
  return parts.join(', ')
}

export const createReportSchema = z
  .object({
    kind: z.enum(REPORT_KINDS, { error: `Choose what kind of problem: ${REPORT_KINDS.join(', ')}.` }),
    severity: z.enum(REPORT_SEVERITIES, { error: `Choose how much it matters: ${REPORT_SEVERITIES.join(', ')}.` }),
    text: reportText,
    place: reportPlaceSchema,
    photoIds: z
      .array(z.uuid({ error: 'No such photo.' }))
      .max(MAX_REPORT_PHOTOS, `At most ${MAX_REPORT_PHOTOS} photos on one report.`)
      .refine((ids) => new Set(ids).size === ids.length, 'The same photo is listed twice.')
      .optional(),
  })
  .strict()
export type CreateReportInput = z.infer<typeof createReportSchema>

export const reportMessageSchema = z.object({ text: reportText }).strict()

export const updateReportSchema = z.object({ state: z.enum(REPORT_STATES, { error: 'A report is open or resolved.' }) }).strict()

/** `GET /api/patterns/:id/reports?state=&kind=&tester=&sort=`: the designer's table filters. */
export const reportFilterSchema = z
  .object({
    state: z.enum(REPORT_STATES).optional(),
    kind: z.enum(REPORT_KINDS).optional(),
    tester: z.uuid({ error: 'No such tester.' }).optional(),
    sort: z.enum(['newest', 'oldest']).default('newest'),
  })
  .strict()
export type ReportFilter = z.infer<typeof reportFilterSchema>

// Answers, parsed by the browser.

const personSchema = z.object({ id: z.string(), displayName: z.string() }).nullable()

export const reportMessageViewSchema = z.object({
  id: z.string(),
  author: personSchema,
  /** The author's part in the test: the pattern's designer, a tester, or an admin. */
  authorRole: z.enum(['designer', 'tester', 'admin']).nullable(),
  text: z.string(),
  createdAt: z.string(),
})
export type ReportMessageView = z.infer<typeof reportMessageViewSchema>

export const reportViewSchema = z.object({
  id: z.string(),
  patternId: z.string(),
  tester: personSchema,
  kind: z.enum(REPORT_KINDS),
  severity: z.enum(REPORT_SEVERITIES),
  text: z.string(),
  place: z.object({ area: z.string().optional(), step: z.number().optional(), page: z.number().optional(), point: z.tuple([z.number(), z.number()]).optional() }),
  /** Where its pin goes, in design inches, and the area label there when it was filed; null for a page alone. */
  pin: z.object({ point: z.tuple([z.number(), z.number()]), area: z.string().nullable() }).nullable(),
  /** The area at its pin has been redrawn since it was filed: the pin keeps its point. */
  changedSince: z.boolean(),
  state: z.enum(REPORT_STATES),
  /** The pattern's revision it was filed against. */
  revision: z.number().int(),
  photos: z.array(z.object({ id: z.string(), url: z.string() })),
  messages: z.array(reportMessageViewSchema),
  createdAt: z.string(),
  updatedAt: z.string(),
})
export type ReportView = z.infer<typeof reportViewSchema>

/** The plan's areas of the first repeat, in inches, with the ring: the map a tester clicks a point on. */
export interface ReportMap {
  readonly ring: { readonly innerRadius: number; readonly outerRadius: number; readonly repeats: number; readonly repeatMode: 'rotate' | 'mirror' }
  readonly areas: readonly { readonly label: string | null; readonly polygon: readonly [number, number][]; readonly point: [number, number] }[]
}

export const reportListAnswerSchema = z.object({ reports: z.array(reportViewSchema) })
export const reportAnswerSchema = z.object({ report: reportViewSchema })
