import { z } from 'zod'
import type { FieldIssue } from '@/lib/errors'

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

/**
 * `GET /api/sales?from=&to=&patternId=`: sales paid from `from` to `to` (both days included, UTC),
 * of one pattern or of all. An unknown parameter is refused (422 naming it).
 */
const salesQuerySchema = z
  .object({
    from: day('A day is written YYYY-MM-DD.'),
    to: day('A day is written YYYY-MM-DD.'),
    patternId: z.preprocess(blankAsAbsent, z.uuid({ error: 'No such pattern.' }).optional()),
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

/** `GET /api/sales`'s answer: rows newest first, totals newest month first, then by currency. */
export interface SalesAnswer {
  sales: SaleRow[]
  totals: SalesMonthTotal[]
}
