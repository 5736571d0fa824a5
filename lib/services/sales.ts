import 'server-only'
import Papa from 'papaparse'
import { Op, type WhereOptions } from 'sequelize'
import { authorize, can, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { NotFoundError } from '@/lib/errors'
import type { SaleRow, SalesAnswer, SalesMonthTotal, SalesQuery } from '@/lib/schemas/sales'
import { Licence, Order, Pattern, User } from '@/models'

/**
 * The designer's sales (issue 14, item 6): paid orders of their patterns, refunds, totals per
 * month and currency, and the same rows as CSV. A designer sees their own patterns' sales, an
 * admin everyone's; the buyer is shown by display name only (their e-mail address is personal
 * data the designer has no need of).
 */

/** The first instant of a `YYYY-MM-DD` day and of the day after it, UTC. */
const startOf = (day: string) => new Date(`${day}T00:00:00.000Z`)
const dayAfter = (day: string) => new Date(startOf(day).getTime() + 24 * 60 * 60 * 1000)
const monthOf = (date: Date) => date.toISOString().slice(0, 7)

/** The `[from, to]` range as a Sequelize condition on one date column; undefined for all time. */
function within(query: SalesQuery): object | undefined {
  if (!query.from && !query.to) return undefined
  return { ...(query.from ? { [Op.gte]: startOf(query.from) } : {}), ...(query.to ? { [Op.lt]: dayAfter(query.to) } : {}) }
}
const isWithin = (date: Date, query: SalesQuery) =>
  (!query.from || date >= startOf(query.from)) && (!query.to || date < dayAfter(query.to))

type OrderWithParts = Order & { pattern?: Pattern; buyer?: User | null }

/**
 * The sales the actor may see, paid within the query's days (a refund counts in the month it was
 * made, so a sale refunded later shows in that later month's totals too).
 *
 * @example listSales(designer, { from: '2026-03-01', to: '2026-03-31' }) // { sales: [ { pattern: 'Hollyberry Wreath', amountCents: 1450, … } ], totals: [ { month: '2026-03', currency: 'USD', grossCents: 4350, … } ] }
 */
export async function listSales(actor: Actor, query: SalesQuery): Promise<SalesAnswer> {
  authorize(actor, 'read-own-sales')
  database()
  const everyone = can(actor, 'read-all-sales')
  if (query.patternId) {
    const pattern = await Pattern.findByPk(query.patternId, { attributes: ['id', 'ownerId', 'state'] })
    if (!pattern) throw new NotFoundError('No such pattern.')
    authorize(actor, 'read-pattern-sales', { ownerId: pattern.ownerId, state: pattern.state })
  }
  const range = within(query)
  const where: WhereOptions = {
    state: { [Op.in]: ['paid', 'refunded'] },
    paidAt: { [Op.ne]: null },
    ...(query.patternId ? { patternId: query.patternId } : {}),
    ...(range ? { [Op.or]: [{ paidAt: range }, { refundedAt: range }] } : {}),
  }
  const orders = (await Order.findAll({
    where,
    include: [
      { model: Pattern, as: 'pattern', attributes: ['id', 'name', 'ownerId'], required: true, ...(everyone ? {} : { where: { ownerId: actor.id } }) },
      { model: User, as: 'buyer', attributes: ['displayName'], required: false },
    ],
    order: [['paidAt', 'DESC'], ['id', 'ASC']],
  })) as OrderWithParts[]
  const licences = orders.length === 0 ? [] : await Licence.findAll({ where: { orderId: { [Op.in]: orders.map((order) => order.id) } }, attributes: ['orderId', 'number'] })
  const numberOf = new Map(licences.map((licence) => [licence.orderId, licence.number]))

  const sales: SaleRow[] = orders
    .filter((order) => isWithin(order.paidAt!, query))
    .map((order) => ({
      orderId: order.id,
      date: order.paidAt!.toISOString(),
      patternId: order.patternId,
      pattern: order.pattern!.name,
      buyer: order.buyer?.displayName ?? null,
      amountCents: order.amountCents,
      currency: order.currency,
      refundedAt: order.state === 'refunded' && order.refundedAt ? order.refundedAt.toISOString() : null,
      licenceNumber: numberOf.get(order.id) ?? null,
    }))
  return { sales, totals: monthlyTotals(orders, query) }
}

/** Sums per month and currency: a sale in the month it was paid, a refund in the month it was made. */
function monthlyTotals(orders: readonly Order[], query: SalesQuery): SalesMonthTotal[] {
  const totals = new Map<string, SalesMonthTotal>()
  const totalFor = (month: string, currency: string) => {
    const key = `${month} ${currency}`
    let total = totals.get(key)
    if (!total) totals.set(key, (total = { month, currency, sales: 0, grossCents: 0, refunds: 0, refundsCents: 0, netCents: 0 }))
    return total
  }
  for (const order of orders) {
    if (order.paidAt && isWithin(order.paidAt, query)) {
      const total = totalFor(monthOf(order.paidAt), order.currency)
      total.sales += 1
      total.grossCents += order.amountCents
      total.netCents += order.amountCents
    }
    if (order.state === 'refunded' && order.refundedAt && isWithin(order.refundedAt, query)) {
      const total = totalFor(monthOf(order.refundedAt), order.currency)
      total.refunds += 1
      total.refundsCents += order.amountCents
      total.netCents -= order.amountCents
    }
  }
  return [...totals.values()].sort((a, b) => (a.month === b.month ? a.currency.localeCompare(b.currency) : b.month.localeCompare(a.month)))
}

const CSV_FIELDS = ['Date', 'Pattern', 'Buyer', 'Licence', 'Currency', 'Amount (cents)', 'Amount', 'Refunded'] as const

/**
 * The sales rows as CSV (one line per sale, amounts in integer cents and as a decimal), with any
 * cell that a spreadsheet would run as a formula (`=`, `+`, `-`, `@`, …) quoted by papaparse.
 *
 * @example salesCsv(rows) // 'Date,Pattern,Buyer,Licence,Currency,Amount (cents),Amount,Refunded\r\n2026-03-04,Hollyberry Wreath,Elsie Varga,WL-001001,USD,1450,14.50,\r\n…'
 */
export function salesCsv(rows: readonly SaleRow[]): string {
  return Papa.unparse(
    {
      fields: [...CSV_FIELDS],
      data: rows.map((row) => [
        row.date.slice(0, 10),
        row.pattern,
        row.buyer ?? 'A former customer',
        row.licenceNumber ?? '',
        row.currency,
        row.amountCents,
        // Every currency sold in has two minor digits (lib/shop/price.ts), so this is exact.
        (row.amountCents / 100).toFixed(2),
        row.refundedAt ? row.refundedAt.slice(0, 10) : '',
      ]),
    },
    { escapeFormulae: true, newline: '\r\n' },
  )
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
