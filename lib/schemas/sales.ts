import { z } from 'zod'
import type { FieldIssue } from '@/lib/errors'
import { MAX_SALES_PAGE_SIZE, SALES_PAGE_SIZE } from '@/lib/limits'

/**
 * The designer's sales table: its query string (`GET /api/sales`, `GET /api/sales/csv` and the
 * /sales page read it with the same schema, so the page's filter works without JavaScript) and
 * the rows and monthly totals it answers with. Money is integer cents of one currency; totals are
 * never summed across currencies.
 */

/** An empty field of the page's form (`?from=`) means "no limit", as if it were not sent. */
const blankAsAbsent = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? undefined : value)

/**
 * Whether the text is a real calendar day written `YYYY-MM-DD` (2026-02-30 is not).
 *
 * @example isDay('2026-02-30') // false
 */
const isDay = (value: string) => /^\d{4}-\d{2}-\d{2}$/.test(value) && !Number.isNaN(Date.parse(`${value}T00:00:00Z`)) && new Date(`${value}T00:00:00Z`).toISOString().startsWith(value)

/** A calendar day, `YYYY-MM-DD`, read in UTC (the dates the table shows). */
const day = (message: string) =>
  z.preprocess(
    blankAsAbsent,
    z.string({ error: message }).refine(isDay, message).optional(),
  )

/** A whole number from a query string (`?limit=50`), from `min` to `max`. */
const wholeNumber = (min: number, max: number, message: string) =>
  z.preprocess(blankAsAbsent, z.coerce.number({ error: message }).int(message).min(min, message).max(max, message).optional())

/**
 * The furthest a page may start (`offset`): far past any designer's sales, and a bound so that a
 * request cannot make the database skip through rows without end. Our choice.
 */
const MAX_SALES_OFFSET = 10_000_000

/**
 * `GET /api/sales?from=&to=&patternId=&limit=&offset=`: sales paid from `from` to `to` (both days
 * included, UTC), of one pattern or of all; the rows `offset` to `offset + limit` of them, newest
 * first (`limit` 1–500, 50 when absent: lib/limits.ts). The monthly totals are always over every
 * row. An unknown parameter is refused (422 naming it).
 */
const salesQuerySchema = z
  .object({
    from: day('A day is written YYYY-MM-DD.'),
    to: day('A day is written YYYY-MM-DD.'),
    patternId: z.preprocess(blankAsAbsent, z.uuid({ error: 'No such pattern.' }).optional()),
    limit: wholeNumber(1, MAX_SALES_PAGE_SIZE, `A page holds 1 to ${MAX_SALES_PAGE_SIZE} sales.`),
    offset: wholeNumber(0, MAX_SALES_OFFSET, 'A page starts at a whole number of sales from the newest (0 is the first).'),
  })
  .strict()
  .refine((query) => query.from === undefined || query.to === undefined || query.from <= query.to, {
    message: 'The last day must not be before the first.',
    path: ['to'],
  })
export type SalesQuery = z.infer<typeof salesQuerySchema>

/**
 * Reads a query string (the API's, or the page's `searchParams`) with the sales schema; a repeated
 * parameter keeps its first value, and each refusal names its parameter.
 *
 * @example readSalesQuery({ from: '2026-13-01' }) // { ok: false, issues: [{ path: 'from', message: 'A day is written YYYY-MM-DD.' }] }
 */
export function readSalesQuery(
  parameters: URLSearchParams | Readonly<Record<string, string | readonly string[] | undefined>>,
): { ok: true; query: SalesQuery } | { ok: false; issues: FieldIssue[] } {
  const object: Record<string, string> = {}
  const entries = parameters instanceof URLSearchParams ? [...parameters] : Object.entries(parameters)
  for (const [name, value] of entries) {
    const first = typeof value === 'string' ? value : value?.[0]
    if (first !== undefined && !(name in object)) object[name] = first
  }
  const parsed = salesQuerySchema.safeParse(object)
  if (parsed.success) return { ok: true, query: parsed.data }
  return {
    ok: false,
    issues: parsed.error.issues.flatMap((issue) =>
      issue.code === 'unrecognized_keys'
        ? issue.keys.map((key) => ({ path: key, message: `The sales table has no filter called “${key}”.` }))
        : [{ path: issue.path.map(String).join('.') || '(query)', message: issue.message }],
    ),
  }
}

/** One sale: a paid order of one of the designer's patterns. */
export interface SaleRow {
  orderId: string
  /** When the payment was verified (ISO 8601, UTC). */
  date: string
  patternId: string
  pattern: string
  /** The buyer's display name (never their e-mail address); null once they deleted their account. */
  buyer: string | null
  amountCents: number
  /** ISO 4217, upper case. */
  currency: string
  /** When the sale was refunded (its licence revoked); null while it stands. */
  refundedAt: string | null
  /** The licence the sale granted; null if the payment has not been processed into one yet. */
  licenceNumber: string | null
  /** The colourway the buyer was looking at when they bought (the licence covers them all); null when none was named. */
  colorway: string | null
}

/** A month's money in one currency: sales paid that month, refunds made that month. */
export interface SalesMonthTotal {
  /** `YYYY-MM`, UTC. */
  month: string
  currency: string
  sales: number
  grossCents: number
  refunds: number
  refundsCents: number
  /** grossCents − refundsCents (below zero in a month with more refunded than sold). */
  netCents: number
}

/** Which rows of all the sales a page holds. */
export interface SalesPage {
  /** Rows asked for (the page's size). */
  limit: number
  /** Rows before this page, newest first. */
  offset: number
  /** Sales in the days asked for, on every page together. */
  total: number
  /** Where the next page starts; null on the last page. */
  nextOffset: number | null
}

/**
 * `GET /api/sales`'s answer: one page of rows newest first, and totals over every row (not only
 * the page's), newest month first, then by currency.
 */
export interface SalesAnswer {
  sales: SaleRow[]
  totals: SalesMonthTotal[]
  page: SalesPage
}

/** The page size a query asks for, or the default (lib/limits.ts). */
export const pageSizeOf = (query: SalesQuery) => query.limit ?? SALES_PAGE_SIZE
