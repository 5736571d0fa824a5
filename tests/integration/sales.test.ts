import { randomUUID } from 'node:crypto'
import Papa from 'papaparse'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { GET as salesCsvRoute } from '@/app/api/sales/csv/route'
import { GET as salesRoute } from '@/app/api/sales/route'
import { Licence, Order, type Pattern } from '@/models'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { clearPayments } from '../support/payments'
import { TEST_ORIGIN, call } from '../support/requests'

beforeEach(async () => {
  await freshDatabase()
  await clearPayments()
})
afterAll(closeDatabase)

/** A paid order and the licence it granted, as a processed payment leaves them; `refundedAt` makes it refunded (licence revoked). */
async function sale(pattern: Pattern, buyer: { id: string }, overrides: { paidAt: string; amountCents?: number; currency?: string; refundedAt?: string; colorway?: string }) {
  const order = await Order.create({
    id: randomUUID(),
    buyerId: buyer.id,
    patternId: pattern.id,
    amountCents: overrides.amountCents ?? 1450,
    currency: overrides.currency ?? 'USD',
    checkoutSessionId: `cs_test_${randomUUID()}`,
    state: overrides.refundedAt ? 'refunded' : 'paid',
    paidAt: new Date(overrides.paidAt),
    refundedAt: overrides.refundedAt ? new Date(overrides.refundedAt) : null,
    colorway: overrides.colorway ?? null,
  })
  const licence = await Licence.create({
    userId: buyer.id,
    patternId: pattern.id,
    orderId: order.id,
    grantedAt: new Date(overrides.paidAt),
    revokedAt: overrides.refundedAt ? new Date(overrides.refundedAt) : null,
  })
  await licence.reload()
  return { order, licence }
}

/** Two designers with a published pattern each, a buyer, and an admin. */
async function scene() {
  const designer = await createUser({ roles: ['quilter', 'designer'], displayName: 'Wren Hollis' })
  const rival = await createUser({ roles: ['quilter', 'designer'], displayName: 'Osric Pell' })
  const admin = await createUser({ roles: ['admin'] })
  const buyer = await createUser({ displayName: 'Elodie Marsh', email: 'elodie@example.test' })
  const wreath = await createPatternRow(designer, { name: 'Rowan Crown', state: 'published' })
  await wreath.update({ priceCents: 1450, currency: 'USD' })
  const rivalRing = await createPatternRow(rival, { name: 'Quince Ring', state: 'published' })
  await rivalRing.update({ priceCents: 990, currency: 'EUR' })
  return { designer, rival, admin, buyer, wreath, rivalRing }
}

const get = async (user: { id: string } | null, query = '') =>
  call(salesRoute, { cookie: user ? await sessionCookieFor(user) : undefined, path: `/api/sales${query}` })

describe('the designer’s sales', () => {
  it('shows a pattern’s sales to its designer and admins only; another designer sees none of them', async () => {
    const { designer, rival, admin, buyer, wreath, rivalRing } = await scene()
    const { licence } = await sale(wreath, buyer, { paidAt: '2026-03-04T10:00:00Z' })
    await sale(rivalRing, buyer, { paidAt: '2026-03-05T10:00:00Z', amountCents: 990, currency: 'EUR' })

    const mine = await get(designer)
    expect(mine.status).toBe(200)
    expect(mine.json!.sales).toEqual([
      expect.objectContaining({ date: '2026-03-04T10:00:00.000Z', pattern: 'Rowan Crown', buyer: 'Elodie Marsh', amountCents: 1450, currency: 'USD', refundedAt: null, licenceNumber: licence.number }),
    ])
    // Personal data: the buyer's display name, never their e-mail address.
    expect(JSON.stringify(mine.json)).not.toContain('elodie@example.test')

    // The other designer sees only their own sale; naming the first designer's pattern is not found.
    const theirs = await get(rival)
    expect(theirs.json!.sales.map((row: { pattern: string }) => row.pattern)).toEqual(['Quince Ring'])
    expect((await get(rival, `?patternId=${wreath.id}`)).status).toBe(404)
    expect((await get(rival, `?patternId=${randomUUID()}`)).status).toBe(404)

    // An admin sees everyone's, and may narrow them to one pattern.
    const all = await get(admin)
    expect(all.json!.sales.map((row: { pattern: string }) => row.pattern)).toEqual(['Quince Ring', 'Rowan Crown'])
    expect((await get(admin, `?patternId=${wreath.id}`)).json!.sales).toHaveLength(1)

    // A quilter who is not a designer is refused; a stranger must sign in.
    expect((await get(buyer)).status).toBe(403)
    expect((await get(null)).status).toBe(401)
  })

  it('totals each month: sales in the month paid, refunds in the month made, net the difference', async () => {
    const { designer, buyer, wreath } = await scene()
    await sale(wreath, buyer, { paidAt: '2026-03-02T09:00:00Z' })
    await sale(wreath, buyer, { paidAt: '2026-03-15T09:00:00Z', refundedAt: '2026-03-20T09:00:00Z' })
    await sale(wreath, buyer, { paidAt: '2026-03-31T23:59:00Z' })
    // Paid in February, refunded in April: its refund belongs to April.
    await sale(wreath, buyer, { paidAt: '2026-02-10T12:00:00Z', refundedAt: '2026-04-01T00:30:00Z' })

    const { json } = await get(designer)
    expect(json!.totals).toEqual([
      // April: no sales, one refund of 1450 → net −1450.
      { month: '2026-04', currency: 'USD', sales: 0, grossCents: 0, refunds: 1, refundsCents: 1450, netCents: -1450 },
      // March: 3 × 1450 = 4350 gross, one refund of 1450, net 4350 − 1450 = 2900.
      { month: '2026-03', currency: 'USD', sales: 3, grossCents: 4350, refunds: 1, refundsCents: 1450, netCents: 2900 },
      { month: '2026-02', currency: 'USD', sales: 1, grossCents: 1450, refunds: 0, refundsCents: 0, netCents: 1450 },
    ])
    expect(json!.sales.map((row: { date: string; refundedAt: string | null }) => [row.date.slice(0, 10), row.refundedAt?.slice(0, 10) ?? null])).toEqual([
      ['2026-03-31', null],
      ['2026-03-15', '2026-03-20'],
      ['2026-03-02', null],
      ['2026-02-10', '2026-04-01'],
    ])

    // March alone (both days included): its three sales and its own refund, not April's.
    const march = await get(designer, '?from=2026-03-01&to=2026-03-31')
    expect(march.json!.sales).toHaveLength(3)
    expect(march.json!.totals).toEqual([{ month: '2026-03', currency: 'USD', sales: 3, grossCents: 4350, refunds: 1, refundsCents: 1450, netCents: 2900 }])
    // April alone: no sale paid in it, but February's refund made in it.
    const april = await get(designer, '?from=2026-04-01&to=2026-04-30')
    expect(april.json!.sales).toEqual([])
    expect(april.json!.totals).toEqual([{ month: '2026-04', currency: 'USD', sales: 0, grossCents: 0, refunds: 1, refundsCents: 1450, netCents: -1450 }])
  })

  it('never adds different currencies together', async () => {
    const { designer, buyer, wreath } = await scene()
    await sale(wreath, buyer, { paidAt: '2026-03-02T09:00:00Z', amountCents: 1450, currency: 'USD' })
    // The price changed currency mid-month: an earlier buyer paid in euros.
    await sale(wreath, buyer, { paidAt: '2026-03-03T09:00:00Z', amountCents: 1300, currency: 'EUR' })
    await sale(wreath, buyer, { paidAt: '2026-03-04T09:00:00Z', amountCents: 1300, currency: 'EUR' })
    const { json } = await get(designer)
    expect(json!.totals).toEqual([
      { month: '2026-03', currency: 'EUR', sales: 2, grossCents: 2600, refunds: 0, refundsCents: 0, netCents: 2600 },
      { month: '2026-03', currency: 'USD', sales: 1, grossCents: 1450, refunds: 0, refundsCents: 0, netCents: 1450 },
    ])
  })

  it('refuses bad parameters by name', async () => {
    const { designer } = await scene()
    const bad = await get(designer, '?from=2026-02-30&to=yesterday&colour=reds')
    expect(bad.status).toBe(422)
    expect(bad.json!.error.issues.map((issue: { path: string }) => issue.path).sort()).toEqual(['colour', 'from', 'to'])
    const backwards = await get(designer, '?from=2026-03-10&to=2026-03-01')
    expect(backwards.status).toBe(422)
    expect(backwards.json!.error.issues).toEqual([{ path: 'to', message: 'The last day must not be before the first.' }])
  })

  it('exports the same rows as CSV that papaparse reads back, a formula-like pattern name escaped', async () => {
    const { designer, buyer, wreath } = await scene()
    await wreath.update({ name: '=HYPERLINK("http://example.test","Rowan")' })
    const { licence } = await sale(wreath, buyer, { paidAt: '2026-03-04T10:00:00Z', colorway: 'Winterberry' })
    await sale(wreath, buyer, { paidAt: '2026-03-05T10:00:00Z', refundedAt: '2026-03-06T10:00:00Z' })

    const response = await salesCsvRoute(
      new Request(`${TEST_ORIGIN}/api/sales/csv?from=2026-03-01&to=2026-03-31`, { headers: { host: new URL(TEST_ORIGIN).host, cookie: await sessionCookieFor(designer) } }),
      { params: Promise.resolve({}) },
    )
    expect(response.status).toBe(200)
    expect(response.headers.get('content-type')).toContain('text/csv')
    expect(response.headers.get('content-disposition')).toBe('attachment; filename="sales-2026-03-01-2026-03-31.csv"')
    const text = await response.text()
    const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    const api = (await get(designer, '?from=2026-03-01&to=2026-03-31')).json!.sales as { date: string; amountCents: number; licenceNumber: string }[]
    expect(parsed.data.map((row) => [row.Date, row['Licence'], Number(row['Amount (cents)']), row.Currency])).toEqual(
      api.map((row) => [row.date.slice(0, 10), row.licenceNumber, row.amountCents, 'USD']),
    )
    expect(parsed.data.at(-1)).toEqual({
      Date: '2026-03-04',
      // papaparse's escapeFormulae puts a ' before a cell starting with =, so a spreadsheet shows it as text.
      Pattern: `'=HYPERLINK("http://example.test","Rowan")`,
      Colourway: 'Winterberry',
      Buyer: 'Elodie Marsh',
      Licence: licence.number,
      Currency: 'USD',
      'Amount (cents)': '1450',
      Amount: '14.50',
      Refunded: '',
    })
    expect(parsed.data[0]!.Refunded).toBe('2026-03-06')
    // A sale whose checkout named no colourway has an empty cell.
    expect(parsed.data[0]!.Colourway).toBe('')
  })

  it('shows the colourway the buyer was looking at, in the table and the CSV', async () => {
    const { designer, buyer, wreath } = await scene()
    await sale(wreath, buyer, { paidAt: '2026-03-04T10:00:00Z', colorway: 'Frost' })
    await sale(wreath, buyer, { paidAt: '2026-03-05T10:00:00Z' })
    const { json } = await get(designer)
    expect(json!.sales.map((row: { colorway: string | null }) => row.colorway)).toEqual([null, 'Frost'])
    const response = await salesCsvRoute(
      new Request(`${TEST_ORIGIN}/api/sales/csv`, { headers: { host: new URL(TEST_ORIGIN).host, cookie: await sessionCookieFor(designer) } }),
      { params: Promise.resolve({}) },
    )
    const parsed = Papa.parse<Record<string, string>>(await response.text(), { header: true, skipEmptyLines: true })
    expect(parsed.meta.fields).toEqual(['Date', 'Pattern', 'Colourway', 'Buyer', 'Licence', 'Currency', 'Amount (cents)', 'Amount', 'Refunded'])
    expect(parsed.data.map((row) => row.Colourway)).toEqual(['', 'Frost'])
  })
})

describe('paging the sales', () => {
  /** `count` sales of the wreath, one a day from 2026-01-01, refunding those `refunded` says (a day later). */
  async function manySales(count: number, refunded: (index: number) => boolean = () => false) {
    const { designer, admin, buyer, wreath } = await scene()
    for (let index = 0; index < count; index += 1) {
      const day = new Date(Date.UTC(2026, 0, 1 + index, 12))
      await sale(wreath, buyer, {
        paidAt: day.toISOString(),
        ...(refunded(index) ? { refundedAt: new Date(day.getTime() + 24 * 60 * 60 * 1000).toISOString() } : {}),
      })
    }
    return { designer, admin }
  }

  it('answers 50 rows a page, newest first, with totals over every row and where the next page starts', async () => {
    // 120 sales from 2026-01-01, one a day: January 31, February 28, March 31, April 30. Every
    // tenth (index 0, 10, …, 110) refunded the day after.
    const { designer, admin } = await manySales(120, (index) => index % 10 === 0)
    const first = await get(designer)
    expect(first.status).toBe(200)
    expect(first.json!.sales).toHaveLength(50)
    expect(first.json!.page).toEqual({ limit: 50, offset: 0, total: 120, nextOffset: 50 })
    // Newest first: the 120th day from 2026-01-01 is 2026-04-30.
    expect(first.json!.sales[0].date.slice(0, 10)).toBe('2026-04-30')
    // The totals hold every sale, not the page's 50: 31 + 28 + 31 + 30 = 120 sold.
    expect(first.json!.totals.reduce((sum: number, total: { sales: number }) => sum + total.sales, 0)).toBe(120)
    // 12 refunds (indexes 0, 10, …, 110) of 1450 each.
    expect(first.json!.totals.reduce((sum: number, total: { refundsCents: number }) => sum + total.refundsCents, 0)).toBe(12 * 1450)
    const january = first.json!.totals.find((total: { month: string }) => total.month === '2026-01')
    // January: 31 sales; refunds made on Jan 2, 12, 22 (indexes 0, 10, 20), Feb 1 (index 30) is February's.
    expect(january).toEqual({ month: '2026-01', currency: 'USD', sales: 31, grossCents: 31 * 1450, refunds: 3, refundsCents: 3 * 1450, netCents: 28 * 1450 })

    const second = await get(designer, '?offset=50')
    const third = await get(designer, '?offset=100')
    expect(second.json!.page).toEqual({ limit: 50, offset: 50, total: 120, nextOffset: 100 })
    expect(third.json!.page).toEqual({ limit: 50, offset: 100, total: 120, nextOffset: null })
    expect(third.json!.sales).toHaveLength(20)
    // The same totals on every page.
    expect(third.json!.totals).toEqual(first.json!.totals)
    // The three pages together are every sale once, newest to oldest.
    const ids = [first, second, third].flatMap((page) => page.json!.sales.map((row: { orderId: string }) => row.orderId))
    expect(new Set(ids).size).toBe(120)
    const dates = [first, second, third].flatMap((page) => page.json!.sales.map((row: { date: string }) => row.date))
    expect(dates).toEqual([...dates].sort().reverse())
    expect(dates.at(-1)!.slice(0, 10)).toBe('2026-01-01')

    // A page size of one's own, within the bound; an admin pages everyone's the same way.
    const small = await get(admin, '?limit=7&offset=14')
    expect(small.json!.sales).toHaveLength(7)
    expect(small.json!.page).toEqual({ limit: 7, offset: 14, total: 120, nextOffset: 21 })
    expect(small.json!.sales[0].orderId).toBe(ids[14])
  })

  it('refuses a page size past the bound, or a page that starts before the first row, by name', async () => {
    const { designer } = await scene()
    for (const [query, path] of [['?limit=501', 'limit'], ['?limit=0', 'limit'], ['?limit=ten', 'limit'], ['?offset=-1', 'offset'], ['?offset=1.5', 'offset']]) {
      const answer = await get(designer, query)
      expect(answer.status, query).toBe(422)
      expect(answer.json!.error.issues.map((issue: { path: string }) => issue.path), query).toEqual([path])
    }
  })

  it('exports every row as CSV, not one page, in batches that neither repeat nor skip a row', async () => {
    // 520 sales: more than one batch of the export (500, lib/limits.ts MAX_SALES_PAGE_SIZE).
    const { designer, buyer, wreath } = await scene()
    const paidAt = new Date('2026-05-01T12:00:00Z')
    const orders = Array.from({ length: 520 }, (_, index) => ({
      id: randomUUID(),
      buyerId: buyer.id,
      patternId: wreath.id,
      amountCents: 1450,
      currency: 'USD',
      checkoutSessionId: `cs_test_${randomUUID()}`,
      state: 'paid' as const,
      // Pairs of sales in the same instant, so the batches' edge falls between equal times.
      paidAt: new Date(paidAt.getTime() - Math.floor(index / 2) * 60_000),
    }))
    await Order.bulkCreate(orders)
    await Licence.bulkCreate(orders.map((order) => ({ userId: buyer.id, patternId: wreath.id, orderId: order.id, grantedAt: order.paidAt })))
    const response = await salesCsvRoute(
      new Request(`${TEST_ORIGIN}/api/sales/csv`, { headers: { host: new URL(TEST_ORIGIN).host, cookie: await sessionCookieFor(designer) } }),
      { params: Promise.resolve({}) },
    )
    expect(response.status).toBe(200)
    const parsed = Papa.parse<Record<string, string>>(await response.text(), { header: true, skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    expect(parsed.data).toHaveLength(520)
    // Each licence once: no row repeated or left out at the batches' edge.
    expect(new Set(parsed.data.map((row) => row.Licence)).size).toBe(520)
    // Compared with the API's pages of 500 and 20, row for row.
    const api = [...(await get(designer, '?limit=500')).json!.sales, ...(await get(designer, '?limit=500&offset=500')).json!.sales]
    expect(parsed.data.map((row) => row.Licence)).toEqual(api.map((row: { licenceNumber: string }) => row.licenceNumber))
  })
})
