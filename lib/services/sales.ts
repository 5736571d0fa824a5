import 'server-only'
import Papa from 'papaparse'
import { Op, QueryTypes, type Includeable, type Order as SortOrder, type WhereOptions } from 'sequelize'
import { authorize, can, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError } from '@/lib/errors'
import { MAX_SALES_PAGE_SIZE } from '@/lib/limits'
import { pageSizeOf, type SaleRow, type SalesAnswer, type SalesMonthTotal, type SalesQuery } from '@/lib/schemas/sales'
import { Licence, Order, Pattern, User } from '@/models'

/**
 * The designer's sales (issue 14, item 6): paid orders of their patterns, refunds, totals per
 * month and currency, and the same rows as CSV. A designer sees their own patterns' sales, an
 * admin everyone's; the buyer is shown by display name only (their e-mail address is personal
 * data the designer has no need of). Rows come a page at a time (an admin's table holds every
 * sale of the shop); the monthly totals are summed by the database over every row, never over a
 * page.
 */

/** The first instant of a `YYYY-MM-DD` day and of the day after it, UTC. */
const startOf = (day: string) => new Date(`${day}T00:00:00.000Z`)
const dayAfter = (day: string) => new Date(startOf(day).getTime() + 24 * 60 * 60 * 1000)

/** The `[from, to]` range as a Sequelize condition on one date column; undefined for all time. */
function within(query: SalesQuery): object | undefined {
  if (!query.from && !query.to) return undefined
  return { ...(query.from ? { [Op.gte]: startOf(query.from) } : {}), ...(query.to ? { [Op.lt]: dayAfter(query.to) } : {}) }
}

type OrderWithParts = Order & { pattern?: Pattern; buyer?: User | null }

/** Who may see which sales: checked once per request, before any row is read. */
interface SalesScope {
  /** Null: every designer's (an admin). */
  readonly ownerId: string | null
  readonly patternId: string | null
}

async function scopeOf(actor: Actor, query: SalesQuery): Promise<SalesScope> {
  authorize(actor, 'read-own-sales')
  database()
  if (query.patternId) {
    const pattern = await Pattern.findByPk(query.patternId, { attributes: ['id', 'ownerId', 'state'] })
    if (!pattern) throw new NotFoundError('No such pattern.')
    authorize(actor, 'read-pattern-sales', { ownerId: pattern.ownerId, state: pattern.state })
  }
  return { ownerId: can(actor, 'read-all-sales') ? null : actor.id, patternId: query.patternId ?? null }
}

/** The sales rows of a scope: orders paid within the query's days, newest first. */
function rowsQuery(scope: SalesScope, query: SalesQuery): { where: WhereOptions; include: Includeable[] } {
  const range = within(query)
  return {
    where: {
      state: { [Op.in]: ['paid', 'refunded'] },
      paidAt: range ? { [Op.ne]: null, ...range } : { [Op.ne]: null },
      ...(scope.patternId ? { patternId: scope.patternId } : {}),
    },
    include: [{ model: Pattern, as: 'pattern', attributes: ['id', 'name', 'ownerId'], required: true, ...(scope.ownerId ? { where: { ownerId: scope.ownerId } } : {}) }],
  }
}

/** Newest first; `id` last so that sales paid in the same instant page in a fixed order. */
const NEWEST_FIRST: SortOrder = [['paidAt', 'DESC'], ['id', 'ASC']]

async function toRows(orders: readonly OrderWithParts[]): Promise<SaleRow[]> {
  const licences = orders.length === 0 ? [] : await Licence.findAll({ where: { orderId: { [Op.in]: orders.map((order) => order.id) } }, attributes: ['orderId', 'number'] })
  const numberOf = new Map(licences.map((licence) => [licence.orderId, licence.number]))
  return orders.map((order) => ({
    orderId: order.id,
    date: order.paidAt!.toISOString(),
    patternId: order.patternId,
    pattern: order.pattern!.name,
    buyer: order.buyer?.displayName ?? null,
    amountCents: order.amountCents,
    currency: order.currency,
    refundedAt: order.state === 'refunded' && order.refundedAt ? order.refundedAt.toISOString() : null,
    licenceNumber: numberOf.get(order.id) ?? null,
    colorway: order.colorway,
  }))
}

/**
 * One page of the sales the actor may see, paid within the query's days, and the totals per
 * month over all of them (a refund counts in the month it was made, so a sale refunded later
 * shows in that later month's totals too).
 *
 * @example listSales(designer, { from: '2026-03-01', to: '2026-03-31', limit: 50, offset: 0 }) // { sales: [ { pattern: 'Hollyberry Wreath', amountCents: 1450, colorway: 'Winterberry', … } ], totals: [ { month: '2026-03', currency: 'USD', grossCents: 4350, … } ], page: { limit: 50, offset: 0, total: 3, nextOffset: null } }
 */
export async function listSales(actor: Actor, query: SalesQuery): Promise<SalesAnswer> {
  const scope = await scopeOf(actor, query)
  const limit = pageSizeOf(query)
  const offset = query.offset ?? 0
  const { where, include } = rowsQuery(scope, query)
  const [orders, total, totals] = await Promise.all([
    Order.findAll({
      where,
      include: [...include, { model: User, as: 'buyer', attributes: ['displayName'], required: false }],
      order: NEWEST_FIRST,
      limit,
      offset,
    }) as Promise<OrderWithParts[]>,
    Order.count({ where, include }),
    monthlyTotals(scope, query),
  ])
  return {
    sales: await toRows(orders),
    totals,
    page: { limit, offset, total, nextOffset: offset + orders.length < total && orders.length > 0 ? offset + orders.length : null },
  }
}

/**
 * Every sale of the query, a batch at a time (for the CSV export), newest first. Each batch starts
 * after the last row of the one before (by its paid time and id, read back by the database so
 * that no precision is lost), so a sale made while the export runs neither repeats nor moves a row.
 */
export async function* allSales(actor: Actor, query: SalesQuery, batchSize = MAX_SALES_PAGE_SIZE): AsyncGenerator<SaleRow[]> {
  const scope = await scopeOf(actor, query)
  const { where, include } = rowsQuery(scope, query)
  const sequelize = database()
  for (let after: string | null = null; ;) {
    const afterLast: WhereOptions = after
      ? {
          [Op.or]: [
            { paidAt: { [Op.lt]: sequelize.literal(`(SELECT paid_at FROM orders WHERE id = ${sequelize.escape(after)})`) } },
            {
              [Op.and]: [
                { paidAt: { [Op.eq]: sequelize.literal(`(SELECT paid_at FROM orders WHERE id = ${sequelize.escape(after)})`) } },
                { id: { [Op.gt]: after } },
              ],
            },
          ],
        }
      : {}
    const orders = (await Order.findAll({
      where: { [Op.and]: [where, afterLast] },
      include: [...include, { model: User, as: 'buyer', attributes: ['displayName'], required: false }],
      order: NEWEST_FIRST,
      limit: batchSize,
    })) as OrderWithParts[]
    if (orders.length === 0) return
    yield await toRows(orders)
    if (orders.length < batchSize) return
    after = orders[orders.length - 1]!.id
  }
}

/**
 * Sums per month (UTC) and currency over every sale the scope sees: a sale in the month it was
 * paid, a refund in the month it was made; each within the query's days.
 */
async function monthlyTotals(scope: SalesScope, query: SalesQuery): Promise<SalesMonthTotal[]> {
  const replacements: Record<string, unknown> = {}
  const conditions = ["o.state IN ('paid', 'refunded')", 'o.paid_at IS NOT NULL']
  if (scope.ownerId) {
    conditions.push('p.owner_id = :ownerId')
    replacements.ownerId = scope.ownerId
  }
  if (scope.patternId) {
    conditions.push('o.pattern_id = :patternId')
    replacements.patternId = scope.patternId
  }
  const between = (column: string) => {
    const parts: string[] = []
    if (query.from) parts.push(`${column} >= :from`)
    if (query.to) parts.push(`${column} < :to`)
    return parts.length === 0 ? 'TRUE' : parts.join(' AND ')
  }
  if (query.from) replacements.from = startOf(query.from)
  if (query.to) replacements.to = dayAfter(query.to)
  const scoped = conditions.join(' AND ')
  const rows = await database().query<{ month: string; currency: string; sales: string; gross: string; refunds: string; refunded: string }>(
    `SELECT month, currency, sum(sales) AS sales, sum(gross) AS gross, sum(refunds) AS refunds, sum(refunded) AS refunded
       FROM (
         SELECT to_char(o.paid_at AT TIME ZONE 'UTC', 'YYYY-MM') AS month, o.currency, 1 AS sales, o.amount_cents AS gross, 0 AS refunds, 0 AS refunded
           FROM orders o JOIN patterns p ON p.id = o.pattern_id
          WHERE ${scoped} AND ${between('o.paid_at')}
         UNION ALL
         SELECT to_char(o.refunded_at AT TIME ZONE 'UTC', 'YYYY-MM'), o.currency, 0, 0, 1, o.amount_cents
           FROM orders o JOIN patterns p ON p.id = o.pattern_id
          WHERE ${scoped} AND o.state = 'refunded' AND o.refunded_at IS NOT NULL AND ${between('o.refunded_at')}
       ) AS money
      GROUP BY month, currency`,
    { type: QueryTypes.SELECT, replacements },
  )
  // node-postgres reads sum() as a string (numeric or bigint); the sums of cents fit a double exactly.
  return rows
    .map((row) => {
      const grossCents = Number(row.gross)
      const refundsCents = Number(row.refunded)
      return { month: row.month, currency: row.currency, sales: Number(row.sales), grossCents, refunds: Number(row.refunds), refundsCents, netCents: grossCents - refundsCents }
    })
    .sort((a, b) => (a.month === b.month ? a.currency.localeCompare(b.currency) : b.month.localeCompare(a.month)))
}

const CSV_FIELDS = ['Date', 'Pattern', 'Colourway', 'Buyer', 'Licence', 'Currency', 'Amount (cents)', 'Amount', 'Refunded'] as const

/**
 * Sales rows as CSV lines (one per sale, amounts in integer cents and as a decimal), with any cell
 * that a spreadsheet would run as a formula (`=`, `+`, `-`, `@`, …) quoted by papaparse; the
 * header line first when `header` is true (the first batch of an export).
 *
 * @example salesCsv(rows) // 'Date,Pattern,Colourway,Buyer,Licence,Currency,Amount (cents),Amount,Refunded\r\n2026-03-04,Hollyberry Wreath,Winterberry,Elsie Varga,WL-001001,USD,1450,14.50,\r\n…'
 */
export function salesCsv(rows: readonly SaleRow[], header = true): string {
  return Papa.unparse(
    {
      fields: [...CSV_FIELDS],
      data: rows.map((row) => [
        row.date.slice(0, 10),
        row.pattern,
        row.colorway ?? '',
        row.buyer ?? 'A former customer',
        row.licenceNumber ?? '',
        row.currency,
        row.amountCents,
        // Every currency sold in has two minor digits (lib/shop/price.ts), so this is exact.
        (row.amountCents / 100).toFixed(2),
        row.refundedAt ? row.refundedAt.slice(0, 10) : '',
      ]),
    },
    { escapeFormulae: true, newline: '\r\n', header },
  )
}

/**
 * Every sale of the query as one CSV file, sent as its rows are read: the header, then a batch of
 * rows at a time (lib/limits.ts MAX_SALES_PAGE_SIZE), so an export of the whole shop never sits in
 * memory at once. Who may see which sales is checked before the first byte.
 */
export async function salesCsvStream(actor: Actor, query: SalesQuery): Promise<ReadableStream<Uint8Array>> {
  await scopeOf(actor, query)
  const batches = allSales(actor, query)
  const encoder = new TextEncoder()
  let first = true
  return new ReadableStream<Uint8Array>({
    async pull(controller) {
      const next = await batches.next()
      if (next.done) {
        if (first) controller.enqueue(encoder.encode(salesCsv([])))
        controller.close()
        return
      }
      controller.enqueue(encoder.encode(`${first ? '' : '\r\n'}${salesCsv(next.value, first)}`))
      first = false
    },
    async cancel() {
      await batches.return(undefined)
    },
  })
}

/** The patterns the sales table can be narrowed to: the actor's own that are or were for sale (an admin's: all), by name. */
export async function salesPatternChoices(actor: Actor): Promise<{ id: string; name: string }[]> {
  authorize(actor, 'read-own-sales')
  database()
  const patterns = await Pattern.findAll({
    where: { priceCents: { [Op.ne]: null }, ...(can(actor, 'read-all-sales') ? {} : { ownerId: actor.id }) },
    attributes: ['id', 'name'],
    order: [['name', 'ASC'], ['id', 'ASC']],
  })
  return patterns.map((pattern) => ({ id: pattern.id, name: pattern.name }))
}
