/**
 * Demo data, the shop's season (an invented scenario): Bramble Lane Quiltworks puts four more
 * wreaths on sale beside the Hollyberry Wreath, in other colour families, repeats, prices and
 * currencies, and quilters buy them over the past three months. One sale is refunded, its
 * licence revoked. The orders, licences and payment-log events are written as the payment worker
 * would have left them (no call to the payment provider): a 'checkout.session.completed' event per
 * sale and a 'charge.refunded' event for the refund, each processed.
 */
import { Op, type Transaction } from 'sequelize'
import type { DesignFile } from '../lib/schemas/design'
import type { PatternCurrency } from '../lib/schemas/pattern'
import { parseDesign } from '../lib/schemas/design'
import { sewingChecklist } from '../lib/sewing-room/checklist'
import { Licence, Order, Pattern, PatternRevision, PaymentEvent, SewingProject, SewingStep, User } from '../models'

const round = (value: number) => Math.round(value * 10_000) / 10_000
/** A point at `radius` inches and `degrees` from +x, rounded to 1/10000 in. */
const polar = (radius: number, degrees: number): [number, number] => [
  round(radius * Math.cos((degrees * Math.PI) / 180)),
  round(radius * Math.sin((degrees * Math.PI) / 180)),
]

type Fabric = { name: string; color: string }
type BandedColorway = { name: string; fabrics: { glow: Fabric; frame: Fabric; sky: Fabric; binding: Fabric } }

/**
 * A banded ring of `repeats` wedges: a glow band by the centre opening, a frame band, and the outer
 * area split at the wedge's middle (the Lantern Medallion's drawing at any count and size).
 */
function bandedRing(name: string, repeats: number, repeatMode: 'rotate' | 'mirror', outerRadius: number, colorways: BandedColorway[]): DesignFile {
  const wedge = 360 / repeats
  const scale = outerRadius / 10
  const [inner, band, frame] = [3 * scale, 6 * scale, 8.5 * scale]
  return {
    format: 'wreathwright-design',
    version: 2,
    name,
    units: 'in',
    ring: { innerRadius: inner, outerRadius, repeats, repeatMode },
    seams: [
      { id: 'inner-band', from: [band, 0], to: polar(band, wedge) },
      { id: 'outer-band', from: [frame, 0], to: polar(frame, wedge) },
      // From the middle of the outer band's chord straight out to the edge.
      { id: 'divide', from: polar(frame * Math.cos((wedge / 2) * (Math.PI / 180)), wedge / 2), to: polar(outerRadius, wedge / 2) },
    ],
    fills: [
      { at: polar((inner + band * Math.cos((wedge / 2) * (Math.PI / 180))) / 2, wedge / 2), fabric: 'glow' },
      { at: polar((band + frame) / 2 - 0.2 * scale, wedge / 2), fabric: 'frame' },
      { at: polar(0.92 * outerRadius, wedge * 0.2), fabric: 'sky' },
      { at: polar(0.92 * outerRadius, wedge * 0.8), fabric: 'sky' },
    ],
    leaves: [],
    stems: [],
    berries: [],
    curls: [],
    colorways,
    order: null,
  }
}

// Fabric names are invented for the demo: descriptions a shop might use, not real products.
const fabric = (name: string, color: string): Fabric => ({ name, color })

/** The season's patterns for sale: designs, prices (integer cents) and what a quilter should know first. */
export const DEMO_SEASON_PATTERNS: readonly { owner: string; design: DesignFile; priceCents: number; currency: PatternCurrency; skillNotes: string }[] = [
  {
    owner: 'marguerite@bramblelane.example',
    design: bandedRing('Rosehip Garland', 12, 'mirror', 9, [
      { name: 'Autumn hedge', fabrics: { glow: fabric('Rosehip red small check', '#b23a48'), frame: fabric('Crabapple scarlet solid', '#c0392b'), sky: fabric('Oatmeal linen-look', '#efe6d5'), binding: fabric('Crabapple scarlet solid', '#c0392b') } },
      { name: 'First frost', fabrics: { glow: fabric('Hawthorn berry print', '#8e2c3a'), frame: fabric('Silver birch tonal', '#c9ccc8'), sky: fabric('Snowberry white tone-on-tone', '#f4f6f4'), binding: fabric('Hawthorn berry print', '#8e2c3a') } },
    ]),
    priceCents: 1200,
    currency: 'EUR',
    skillNotes: 'Twelve mirrored wedges: narrow points, so trim each seam allowance to 1/4 in before pressing. Confident beginners.',
  },
  {
    owner: 'marguerite@bramblelane.example',
    design: bandedRing('Tidepool Halo', 8, 'rotate', 10, [
      { name: 'Low tide', fabrics: { glow: fabric('Seafoam watercolour batik', '#cfe8e3'), frame: fabric('Harbour teal linen-look', '#2a7f8f'), sky: fabric('Deep lagoon solid', '#1f4e5f'), binding: fabric('Deep lagoon solid', '#1f4e5f') } },
      { name: 'Storm glass', fabrics: { glow: fabric('Pewter crossweave', '#9aa5a8'), frame: fabric('Slate blue shot cotton', '#4a6382'), sky: fabric('Midnight ink solid', '#1d3557'), binding: fabric('Pewter crossweave', '#9aa5a8') } },
    ]),
    priceCents: 1100,
    currency: 'GBP',
    skillNotes: 'Eight rotated wedges and three foundations each; long straight seams. Good first foundation-pieced wreath.',
  },
  {
    owner: 'marguerite@bramblelane.example',
    design: bandedRing('Meadow Rue Circlet', 10, 'mirror', 11, [
      { name: 'Hayfield', fabrics: { glow: fabric('Buttercup yellow pin dot', '#f2c14e'), frame: fabric('Meadow green homespun', '#5b8c3a'), sky: fabric('Cream tone-on-tone', '#f6f1e7'), binding: fabric('Meadow green homespun', '#5b8c3a') } },
      { name: 'Evening meadow', fabrics: { glow: fabric('Lavender sprig print', '#9c89b8'), frame: fabric('Fern shadow batik', '#3d5a40'), sky: fabric('Dusk grey solid', '#5e6472'), binding: fabric('Fern shadow batik', '#3d5a40') } },
    ]),
    priceCents: 1600,
    currency: 'CAD',
    skillNotes: 'A 22 in circlet of ten wedges: the largest of the season. Some experience with curved piecing for the binding helps.',
  },
  {
    owner: 'marguerite@bramblelane.example',
    design: bandedRing('Sloe Berry Ring', 6, 'rotate', 8, [
      { name: 'Sloe', fabrics: { glow: fabric('Plum wine crossweave', '#5c2a4a'), frame: fabric('Damson tonal', '#7b3f61'), sky: fabric('Blackthorn blossom white', '#f3eef0'), binding: fabric('Plum wine crossweave', '#5c2a4a') } },
      { name: 'Bloom', fabrics: { glow: fabric('Mauve heather solid', '#b784a7'), frame: fabric('Orchid shot cotton', '#8e5a8a'), sky: fabric('Pale lilac tone-on-tone', '#ece4f0'), binding: fabric('Orchid shot cotton', '#8e5a8a') } },
    ]),
    priceCents: 950,
    currency: 'USD',
    skillNotes: 'Six wide wedges and a 16 in ring: a quick weekend make, suitable for beginners.',
  },
]

/** What the demo's flagship wreath tells a quilter about its skills (set with the season's listings). */
export const DEMO_WREATH_SKILL_NOTES = 'Folded leaves stacked into the seams and a pinwheel centre; berries appliquéd or embroidered. Intermediate.'

interface DemoSale {
  /** Makes the order's provider ids (`cs_demo_<key>`, `pi_demo_<key>`, `evt_demo_<key>`), so a second run finds it. */
  readonly key: string
  readonly buyer: string
  readonly pattern: string
  /** Paid this many whole months before the current one, on this day of that month (UTC, 10:00 + the day's hours). */
  readonly monthsAgo: number
  readonly day: number
  /** Refunded this many days after the payment; its licence revoked then. */
  readonly refundedDaysLater?: number
}

/** The season's sales, over the three months before this one: Elsie and Ruben build libraries; one refund. */
export const DEMO_SALES: readonly DemoSale[] = [
  { key: 's01', buyer: 'elsie@quilters.example', pattern: 'Hollyberry Wreath', monthsAgo: 3, day: 4 },
  { key: 's02', buyer: 'ruben@quilters.example', pattern: 'Hollyberry Wreath', monthsAgo: 3, day: 9 },
  { key: 's03', buyer: 'priya@testers.example', pattern: 'Rosehip Garland', monthsAgo: 3, day: 17 },
  { key: 's04', buyer: 'agnes.abernethy@quilters.example', pattern: 'Hollyberry Wreath', monthsAgo: 3, day: 22 },
  { key: 's05', buyer: 'elsie@quilters.example', pattern: 'Rosehip Garland', monthsAgo: 2, day: 2 },
  { key: 's06', buyer: 'ruben@quilters.example', pattern: 'Tidepool Halo', monthsAgo: 2, day: 11, refundedDaysLater: 2 },
  { key: 's07', buyer: 'hana@testers.example', pattern: 'Tidepool Halo', monthsAgo: 2, day: 14 },
  { key: 's08', buyer: 'anselm.blackthorn@sewing-circle.example', pattern: 'Hollyberry Wreath', monthsAgo: 2, day: 20 },
  { key: 's09', buyer: 'beatrix.cresswell@patchwork-guild.example', pattern: 'Meadow Rue Circlet', monthsAgo: 2, day: 26 },
  { key: 's10', buyer: 'elsie@quilters.example', pattern: 'Meadow Rue Circlet', monthsAgo: 1, day: 3 },
  { key: 's11', buyer: 'ruben@quilters.example', pattern: 'Sloe Berry Ring', monthsAgo: 1, day: 8 },
  { key: 's12', buyer: 'agnes.abernethy@quilters.example', pattern: 'Sloe Berry Ring', monthsAgo: 1, day: 15 },
  { key: 's13', buyer: 'priya@testers.example', pattern: 'Hollyberry Wreath', monthsAgo: 1, day: 21 },
]

/**
 * When a demo sale was paid: `monthsAgo` whole months before `now`'s month, on `day`, at 10:00 UTC
 * plus the sale's number in hours (so no two share an instant).
 *
 * @example demoSaleDate({ key: 's03', monthsAgo: 2, day: 17 }, new Date('2026-12-02T00:00:00Z')).toISOString() // '2026-10-17T13:00:00.000Z'
 */
function demoSaleDate(sale: Pick<DemoSale, 'key' | 'monthsAgo' | 'day'>, now: Date = new Date()): Date {
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth() - sale.monthsAgo, sale.day, 10 + Number(sale.key.slice(1))))
}

const DAY_MS = 24 * 60 * 60 * 1000

/** An event as the provider sends it, with only the fields the payment worker reads (lib/payments/process.ts). */
const providerEvent = (id: string, type: string, object: Record<string, unknown>) =>
  // The column's type is `unknown` marked optional on create; a plain object is what it holds.
  ({ id, object: 'event', type, data: { object } }) as unknown as PaymentEvent['payload']

/**
 * Writes the season's orders, licences and processed payment events that are not there yet (found
 * by their checkout session's id), at each pattern's price. Returns how many sales were added.
 */
export async function seedSeasonSales(transaction: Transaction): Promise<number> {
  const existing = new Set(
    (await Order.findAll({ where: { checkoutSessionId: { [Op.in]: DEMO_SALES.map((sale) => `cs_demo_${sale.key}`) } }, attributes: ['checkoutSessionId'], transaction })).map(
      (order) => order.checkoutSessionId,
    ),
  )
  const missing = DEMO_SALES.filter((sale) => !existing.has(`cs_demo_${sale.key}`))
  if (missing.length === 0) {
    await seedDemoSewing(transaction)
    return 0
  }
  const buyers = new Map(
    (await User.findAll({ where: { email: { [Op.in]: missing.map((sale) => sale.buyer) } }, attributes: ['id', 'email'], transaction })).map((user) => [user.email, user]),
  )
  const patterns = new Map(
    (await Pattern.findAll({ where: { name: { [Op.in]: missing.map((sale) => sale.pattern) }, priceCents: { [Op.ne]: null } }, attributes: ['id', 'name', 'priceCents', 'currency'], transaction })).map(
      (pattern) => [pattern.name, pattern],
    ),
  )
  const loggedEvents = new Set(
    (await PaymentEvent.findAll({ where: { providerEventId: { [Op.like]: 'evt_demo_%' } }, attributes: ['providerEventId'], transaction })).map((event) => event.providerEventId),
  )
  let added = 0
  const firstSale = new Map<string, number>()
  for (const sale of missing) {
    const buyer = buyers.get(sale.buyer)
    const pattern = patterns.get(sale.pattern)
    if (!buyer || !pattern) continue
    const paidAt = demoSaleDate(sale)
    const refundedAt = sale.refundedDaysLater === undefined ? null : new Date(paidAt.getTime() + sale.refundedDaysLater * DAY_MS)
    const [amountCents, currency] = [pattern.priceCents!, pattern.currency!]
    const order = await Order.create(
      {
        id: crypto.randomUUID(),
        buyerId: buyer.id,
        patternId: pattern.id,
        amountCents,
        currency,
        state: refundedAt ? ('refunded' as const) : ('paid' as const),
        checkoutSessionId: `cs_demo_${sale.key}`,
        paymentIntentId: `pi_demo_${sale.key}`,
        createdAt: new Date(paidAt.getTime() - 3 * 60 * 1000),
        paidAt,
        refundedAt,
      },
      { transaction },
    )
    const licence = await Licence.create({ userId: buyer.id, patternId: pattern.id, orderId: order.id, grantedAt: paidAt, revokedAt: refundedAt }, { transaction })
    await licence.reload({ attributes: ['number'], transaction })
    const processedAt = new Date(paidAt.getTime() + 2000)
    // An event left from an earlier load whose order was deleted since stays as it is (its id is unique).
    if (!loggedEvents.has(`evt_demo_${sale.key}_paid`)) {
      await PaymentEvent.create(
        {
          providerEventId: `evt_demo_${sale.key}_paid`,
          type: 'checkout.session.completed',
          state: 'processed',
          note: `licence ${licence.number} granted`,
          paymentIntentId: `pi_demo_${sale.key}`,
          payload: providerEvent(`evt_demo_${sale.key}_paid`, 'checkout.session.completed', {
            id: `cs_demo_${sale.key}`,
            object: 'checkout.session',
            payment_status: 'paid',
            amount_total: amountCents,
            currency: currency.toLowerCase(),
            payment_intent: `pi_demo_${sale.key}`,
          }),
          attempts: 1,
          receivedAt: new Date(paidAt.getTime() - 1000),
          processedAt,
        },
        { transaction },
      )
    }
    if (refundedAt && !loggedEvents.has(`evt_demo_${sale.key}_refund`)) {
      await PaymentEvent.create(
        {
          providerEventId: `evt_demo_${sale.key}_refund`,
          type: 'charge.refunded',
          state: 'processed',
          note: `refunded: licence ${licence.number} revoked`,
          paymentIntentId: `pi_demo_${sale.key}`,
          payload: providerEvent(`evt_demo_${sale.key}_refund`, 'charge.refunded', {
            id: `ch_demo_${sale.key}`,
            object: 'charge',
            refunded: true,
            amount: amountCents,
            amount_refunded: amountCents,
            currency: currency.toLowerCase(),
            payment_intent: `pi_demo_${sale.key}`,
          }),
          attempts: 1,
          receivedAt: new Date(refundedAt.getTime() - 1000),
          processedAt: new Date(refundedAt.getTime() + 2000),
        },
        { transaction },
      )
    }
    added += 1
    firstSale.set(pattern.id, Math.min(firstSale.get(pattern.id) ?? Infinity, paidAt.getTime()))
  }
  // A pattern sold months ago went on sale before its first sale (the shop's "newest" reads this),
  // not when this script happened to create it: a fortnight before.
  for (const [patternId, soldAt] of firstSale) {
    await Pattern.update({ publishedAt: new Date(soldAt - 14 * DAY_MS) }, { where: { id: patternId, publishedAt: { [Op.gt]: new Date(soldAt) } }, transaction })
  }
  await seedDemoSewing(transaction)
  return added
}

/**
 * The sewing room's demo: Elsie is making the Hollyberry Wreath she bought, in its first colourway
 * at 18 in, and is part way through the first repeat — the leaves folded, everything cut, the
 * first areas sewn, one step with a note.
 */
export const DEMO_SEWING = {
  buyer: 'elsie@quilters.example',
  pattern: 'Hollyberry Wreath',
  name: 'Hollyberry for the hall',
  colorway: 0,
  diameterIn: 18,
  paper: 'letter',
  /** Steps of repeat 1 done, after every leaf and cutting step. */
  doneInFirstRepeat: ['r1:area:A1', 'r1:area:A2', 'r1:area:A3'],
  note: { stepId: 'r1:area:A2', text: 'A glue dot held the leaf better than a pin.' },
} as const

/** Writes Elsie's sewing project and its progress, unless she already has one on the pattern. */
async function seedDemoSewing(transaction: Transaction): Promise<void> {
  const buyer = await User.findOne({ where: { email: DEMO_SEWING.buyer }, attributes: ['id'], transaction })
  const pattern = buyer ? await Pattern.findOne({ where: { name: DEMO_SEWING.pattern, priceCents: { [Op.ne]: null } }, transaction }) : null
  const licence = buyer && pattern ? await Licence.findOne({ where: { userId: buyer.id, patternId: pattern.id, revokedAt: null }, transaction }) : null
  if (!buyer || !pattern || !licence) return
  if ((await SewingProject.count({ where: { ownerId: buyer.id, patternId: pattern.id }, transaction })) > 0) return
  const revision = await PatternRevision.findOne({ where: { patternId: pattern.id, revision: pattern.revision }, attributes: ['id', 'design'], transaction })
  const parsed = revision ? parseDesign(revision.design) : null
  if (!revision || !parsed?.ok) return
  const { steps } = sewingChecklist(parsed.design, { colorway: DEMO_SEWING.colorway, diameterIn: DEMO_SEWING.diameterIn })
  const done = steps.filter((step) => step.group === 'prepare-leaves' || step.group === 'cut' || (DEMO_SEWING.doneInFirstRepeat as readonly string[]).includes(step.id))
  // Worked on over the last fortnight, a step or two an evening.
  const startedAt = new Date(Date.now() - 14 * DAY_MS)
  const project = await SewingProject.create(
    {
      id: crypto.randomUUID(),
      ownerId: buyer.id,
      licenceId: licence.id,
      invitationId: null,
      patternId: pattern.id,
      patternRevisionId: String(revision.id),
      colorwayIndex: DEMO_SEWING.colorway,
      diameterIn: DEMO_SEWING.diameterIn,
      paper: DEMO_SEWING.paper,
      name: DEMO_SEWING.name,
      createdAt: startedAt,
      updatedAt: new Date(startedAt.getTime() + done.length * (DAY_MS / 2)),
    },
    { transaction, silent: true },
  )
  await SewingStep.bulkCreate(
    done.map((step, index) => ({
      projectId: project.id,
      stepId: step.id,
      done: true,
      note: step.id === DEMO_SEWING.note.stepId ? DEMO_SEWING.note.text : null,
      updatedAt: new Date(startedAt.getTime() + (index + 1) * (DAY_MS / 2)),
    })),
    // bulkCreate keeps an updatedAt it is given.
    { transaction },
  )
}
