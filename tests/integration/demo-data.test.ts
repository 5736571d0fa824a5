import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { parseDesign } from '@/lib/schemas/design'
import { Op } from 'sequelize'
import { testerIdsOf } from '@/lib/services/testers'
import { AdminAuditEntry, Invitation, Licence, Order, OutgoingMail, Pattern, PatternRevision, PaymentEvent, Report, ReportMessage, ReportPhoto, Upload, User } from '@/models'
import { DEMO_CROWD_SIZE, DEMO_PATTERNS, DEMO_PEOPLE, DEMO_PEOPLE_IN_STATES, DEMO_REPORTS, DEMO_TEST_ROUND, demoCrowd, seedDemoData } from '@/scripts/demo-data'
import { DEMO_COVERS } from '@/scripts/demo-covers'
import { DEMO_SALES, DEMO_SEASON_PATTERNS } from '@/scripts/demo-season'
import { listLibrary } from '@/lib/services/licences'
import { listSales } from '@/lib/services/sales'
import { listShopPatterns } from '@/lib/services/shop-listings'
import { clearPayments } from '../support/payments'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'
import { emptyBucket, storedKeys } from '../support/object-store'

beforeEach(async () => {
  await freshDatabase()
  // The payment log has no tie to people or patterns, so emptying them leaves it: empty it too.
  await clearPayments()
  await emptyAdminLogs()
  await emptyBucket()
})
afterAll(closeDatabase)

/** Everyone the demo makes: the people to sign in as, the people in other states, the generated crowd. */
const EVERYONE = DEMO_PEOPLE.length + DEMO_PEOPLE_IN_STATES.length + DEMO_CROWD_SIZE

describe('demo data', () => {
  it('loads every demo person and pattern, each pattern with its first revision', async () => {
    const loaded = await seedDemoData()
    expect(loaded).toEqual({ people: EVERYONE, patterns: DEMO_PATTERNS.length, reports: DEMO_REPORTS.length, sales: DEMO_SALES.length })
    expect(await User.count()).toBe(EVERYONE)
    expect(await PatternRevision.count()).toBe(DEMO_PATTERNS.length)
    const states = (await Pattern.findAll()).map((pattern) => pattern.state).sort()
    // The two studios' five, and the season's four more on sale.
    expect(states).toEqual(['draft', 'draft', 'published', 'published', 'published', 'published', 'published', 'retired', 'testing'])
  })

  it('neither duplicates nor overwrites anything when loaded again', async () => {
    await seedDemoData()
    const wreath = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
    await wreath!.update({ revision: 7, design: { ...(wreath!.design as object), seams: [] } })
    const entries = await AdminAuditEntry.count()
    const mail = await OutgoingMail.count()
    const uploads = await Upload.count()
    const payments = [await Order.count(), await Licence.count(), await PaymentEvent.count()]
    expect(await seedDemoData()).toEqual({ people: 0, patterns: 0, reports: 0, sales: 0 })
    expect([await Order.count(), await Licence.count(), await PaymentEvent.count()]).toEqual(payments)
    expect([await Report.count(), await Invitation.count(), await Upload.count()]).toEqual([DEMO_REPORTS.length, DEMO_TEST_ROUND.testers.length + DEMO_TEST_ROUND.pendingInvitations.length, uploads])
    expect(await User.count()).toBe(EVERYONE)
    expect([await AdminAuditEntry.count(), await OutgoingMail.count()]).toEqual([entries, mail])
    expect(await Pattern.count()).toBe(DEMO_PATTERNS.length)
    await wreath!.reload()
    expect(wreath!.revision).toBe(7)
  })

  it('stores every demo pattern in design format version 2, in at least two colourways with every fabric named', async () => {
    await seedDemoData()
    for (const pattern of await Pattern.findAll()) {
      const parsed = parseDesign(pattern.design)
      expect(parsed.ok, pattern.name).toBe(true)
      if (!parsed.ok) continue
      expect((pattern.design as { version: number }).version, pattern.name).toBe(2)
      expect(parsed.file.colorways!.length, pattern.name).toBeGreaterThanOrEqual(2)
      for (const colorway of parsed.file.colorways!) {
        for (const [role, fabric] of Object.entries(colorway.fabrics)) expect(fabric.name, `${pattern.name} / ${colorway.name}`).not.toBe(role)
      }
    }
  })

  it('holds only valid design files', () => {
    for (const demo of DEMO_PATTERNS) expect(parseDesign(demo.design).ok, demo.design.name).toBe(true)
  })

  it('gives every admin desk screen something to show: requests, an unverified and a disabled person, pages of people, log entries', async () => {
    await seedDemoData()
    const odile = await User.findOne({ where: { email: 'odile@wreathwright.example' } })
    expect(odile?.roles).toContain('admin')
    const requests = await User.findAll({ where: { designerRequestedAt: { [Op.ne]: null } } })
    expect(requests.map((user) => user.displayName).sort()).toEqual(['Isadora Quennell', 'Wilhelmina Thorne'])
    for (const user of requests) expect(user.roles).not.toContain('designer')
    expect((await User.findOne({ where: { email: 'bastien@quilters.example' } }))?.emailVerifiedAt).toBeNull()
    expect((await User.findAll({ where: { disabledAt: { [Op.ne]: null } } })).map((user) => user.email)).toEqual(['corentin@quilters.example'])
    // More than one page of the users table (50 a page, lib/schemas/admin.ts).
    expect(await User.count()).toBeGreaterThan(50 * 5)
    expect(await User.count({ where: { emailVerifiedAt: null } })).toBeGreaterThan(1)

    const entries = await AdminAuditEntry.findAll({ order: [['createdAt', 'ASC']] })
    expect(entries.map((entry) => entry.action)).toEqual(['approve-designer-request', 'grant-role', 'disable-account'])
    for (const entry of entries) {
      expect(entry.actorId).toBe(odile!.id)
      expect(entry.createdAt.getTime()).toBeLessThan(Date.now() - 24 * 60 * 60 * 1000)
    }
    expect((await OutgoingMail.findAll()).map((row) => row.state).sort()).toEqual(['failed', 'sent', 'sent'])
  })

  it('prints only the few people worth signing in as, none of the generated crowd', () => {
    expect(DEMO_PEOPLE.length).toBeLessThanOrEqual(10)
    const crowd = new Set(demoCrowd().map((person) => person.email))
    expect(crowd.size).toBe(DEMO_CROWD_SIZE)
    for (const person of DEMO_PEOPLE) expect(crowd.has(person.email)).toBe(false)
  })

  it('prices every pattern that is or was for sale, in integer cents', async () => {
    await seedDemoData()
    for (const pattern of await Pattern.findAll()) {
      const forSale = pattern.state === 'published' || pattern.state === 'retired'
      expect(pattern.priceCents !== null, pattern.name).toBe(forSale)
      expect(pattern.currency !== null, pattern.name).toBe(forSale)
      if (forSale) expect(Number.isInteger(pattern.priceCents), pattern.name).toBe(true)
    }
  })

  it('gives the pattern in testing two testers, a pending invitation, and open and resolved reports with threads and stored photos', async () => {
    await seedDemoData()
    const pattern = (await Pattern.findOne({ where: { name: DEMO_TEST_ROUND.pattern } }))!
    expect(pattern.state).toBe('testing')
    const testers = await User.findAll({ where: { id: await testerIdsOf(pattern.id) } })
    expect(testers.map((user) => user.email).sort()).toEqual([...DEMO_TEST_ROUND.testers].sort())
    expect(await Invitation.count({ where: { patternId: pattern.id, userId: null } })).toBe(DEMO_TEST_ROUND.pendingInvitations.length)

    const reports = await Report.findAll({ where: { patternId: pattern.id } })
    expect(reports.map((report) => report.state).sort()).toEqual(['open', 'open', 'open', 'resolved'])
    expect(new Set(reports.map((report) => report.testerId)).size).toBe(2)
    // Pins as filed: area A3 at its label, step 2 at A2 (the second area sewn), a point in A1, a page nowhere.
    const byPlace = (key: string) => reports.find((report) => key in report.place)!
    expect(byPlace('area').pin?.area).toBe('A3')
    expect(byPlace('step').pin?.area).toBe('A2')
    expect(byPlace('point').pin).toEqual({ point: [6.1, 5.8], area: 'A1' })
    expect(byPlace('page').pin).toBeNull()
    expect(await ReportMessage.count()).toBe(DEMO_REPORTS.reduce((sum, report) => sum + report.thread.length, 0))

    const photos = await ReportPhoto.findAll()
    expect(photos).toHaveLength(3)
    const uploads = await Upload.findAll({ where: { id: photos.map((photo) => photo.uploadId) } })
    expect(uploads.map((upload) => upload.kind)).toEqual(['report-photo', 'report-photo', 'report-photo'])
    for (const upload of uploads) {
      const report = reports.find((candidate) => photos.some((photo) => photo.uploadId === upload.id && photo.reportId === candidate.id))!
      // Each photo belongs to the tester whose report shows it, and its object is in the store.
      expect(upload.ownerId).toBe(report.testerId)
    }
    // Every stored object is an upload's: the report photos, and the season's covers.
    expect((await storedKeys()).sort()).toEqual((await Upload.findAll()).map((upload) => upload.key).sort())
  })

  it('gives two of the season’s patterns an uploaded cover, owned by their designer and stored; the demo wreath keeps its drawn ring', async () => {
    await seedDemoData()
    const shop = await listShopPatterns({ sort: 'newest', page: 1 })
    const withCover = shop.patterns.filter((listing) => listing.coverUrl)
    expect(withCover.map((listing) => listing.name).sort()).toEqual(DEMO_COVERS.map((cover) => cover.pattern).sort())
    expect(shop.patterns.find((listing) => listing.name === 'Hollyberry Wreath')?.coverUrl).toBeNull()
    for (const listing of withCover) {
      const pattern = await Pattern.findByPk(listing.id)
      const upload = await Upload.findByPk(pattern!.coverUploadId!)
      expect([upload!.kind, upload!.ownerId]).toEqual(['cover', pattern!.ownerId])
      expect(await storedKeys()).toContain(upload!.key)
    }
  })

  it('fills the shop for a season: patterns on sale in several colour families, repeats, prices and currencies, each with skill notes', async () => {
    await seedDemoData()
    const shop = await listShopPatterns({ sort: 'newest', page: 1 })
    expect(shop.patterns.map((listing) => listing.name).sort()).toEqual(
      ['Hollyberry Wreath', ...DEMO_SEASON_PATTERNS.map((pattern) => pattern.design.name)].sort(),
    )
    for (const listing of shop.patterns) expect(listing.skillNotes, listing.name).toBeTruthy()
    expect(new Set(shop.patterns.map((listing) => listing.currency)).size).toBeGreaterThanOrEqual(4)
    expect(new Set(shop.patterns.map((listing) => listing.repeats)).size).toBeGreaterThanOrEqual(4)
    expect(new Set(shop.patterns.map((listing) => listing.priceCents)).size).toBe(shop.patterns.length)
    expect(new Set(shop.patterns.flatMap((listing) => listing.colourFamilies)).size).toBeGreaterThanOrEqual(5)
  })

  it('sold the season over the three months before this one: licences in libraries, one refund revoked, a processed event for each', async () => {
    await seedDemoData()
    const orders = await Order.findAll()
    expect(orders).toHaveLength(DEMO_SALES.length)
    // Each order at its pattern's price, paid in one of the three whole months before this one.
    const now = new Date()
    const months = [1, 2, 3].map((back) => new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - back, 1)).toISOString().slice(0, 7))
    const prices = new Map((await Pattern.findAll()).map((pattern) => [pattern.id, [pattern.priceCents, pattern.currency]]))
    for (const order of orders) {
      expect([order.amountCents, order.currency]).toEqual(prices.get(order.patternId))
      expect(months).toContain(order.paidAt!.toISOString().slice(0, 7))
    }
    // Each pattern went on sale before its first sale.
    for (const pattern of await Pattern.findAll({ where: { id: orders.map((order) => order.patternId) } })) {
      const first = Math.min(...orders.filter((order) => order.patternId === pattern.id).map((order) => order.paidAt!.getTime()))
      expect(pattern.publishedAt!.getTime(), pattern.name).toBeLessThan(first)
    }
    const refunded = orders.filter((order) => order.state === 'refunded')
    expect(refunded).toHaveLength(1)
    expect(refunded[0]!.refundedAt!.getTime()).toBeGreaterThan(refunded[0]!.paidAt!.getTime())
    const revoked = await Licence.findAll({ where: { revokedAt: { [Op.ne]: null } } })
    expect(revoked.map((licence) => licence.orderId)).toEqual([refunded[0]!.id])

    // The payment log: one processed payment per sale and one processed refund, naming the licence.
    const events = await PaymentEvent.findAll()
    expect(events.map((event) => event.state).every((state) => state === 'processed')).toBe(true)
    expect(events.filter((event) => event.type === 'checkout.session.completed')).toHaveLength(DEMO_SALES.length)
    const refundEvents = events.filter((event) => event.type === 'charge.refunded')
    expect(refundEvents.map((event) => event.paymentIntentId)).toEqual([refunded[0]!.paymentIntentId])
    expect(refundEvents[0]!.note).toBe(`refunded: licence ${(await Licence.findOne({ where: { orderId: refunded[0]!.id } }))!.number} revoked`)

    // Elsie and Ruben have libraries; Ruben's refunded pattern is not in his.
    const person = async (email: string) => (await User.findOne({ where: { email } }))!
    const elsie = await listLibrary(await person('elsie@quilters.example'))
    expect(elsie.map((entry) => entry.patternName).sort()).toEqual(['Hollyberry Wreath', 'Meadow Rue Circlet', 'Rosehip Garland'])
    const ruben = await listLibrary(await person('ruben@quilters.example'))
    expect(ruben.map((entry) => entry.patternName).sort()).toEqual(['Hollyberry Wreath', 'Sloe Berry Ring'])

    // The designer's sales table has three months, the refund among them.
    const marguerite = await person('marguerite@bramblelane.example')
    const sales = await listSales(marguerite, {})
    expect(sales.sales).toHaveLength(DEMO_SALES.length)
    expect(new Set(sales.totals.map((total) => total.month))).toEqual(new Set(months))
    expect(sales.totals.reduce((sum, total) => sum + total.refunds, 0)).toBe(1)
  })
})
