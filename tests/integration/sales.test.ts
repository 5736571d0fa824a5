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
async function sale(pattern: Pattern, buyer: { id: string }, overrides: { paidAt: string; amountCents?: number; currency?: string; refundedAt?: string }) {
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
    const { licence } = await sale(wreath, buyer, { paidAt: '2026-03-04T10:00:00Z' })
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
      Buyer: 'Elodie Marsh',
      Licence: licence.number,
      Currency: 'USD',
      'Amount (cents)': '1450',
      Amount: '14.50',
      Refunded: '',
    })
    expect(parsed.data[0]!.Refunded).toBe('2026-03-06')
  })
})
