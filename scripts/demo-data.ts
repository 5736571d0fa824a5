/**
 * Demo data: an invented scenario. Two small studios — Bramble Lane Quiltworks (Marguerite Okafor)
 * and Juniper Thread Co. (Tomasz Lindqvist) — a pattern tester, quilters, an admin, people waiting
 * for a designer account, one who has not verified their address, one whose account is disabled,
 * and a few hundred generated quilters so that the admin desk's table has pages to turn. The admin
 * desk's audit log and mail log start with the few entries this history would have left.
 * Loading is idempotent: people are found by e-mail and patterns by owner and name, so a second
 * run neither duplicates nor overwrites anything a person changed in the meantime.
 */
import { Op, type Transaction } from 'sequelize'
import { hashPassword } from '../lib/auth/password'
import { database } from '../lib/db'
import type { MailKind } from '../lib/mail/kinds'
import { emptyDesign } from '../lib/new-design'
import type { Role } from '../lib/roles'
import type { DesignFile } from '../lib/schemas/design'
import { designFileSchema } from '../lib/schemas/design'
import type { PatternCurrency, PatternState } from '../lib/schemas/pattern'
import { planDesign } from '../geometry'
import { pinOf } from '../lib/report-place'
import { parseDesign } from '../lib/schemas/design'
import type { ReportKind, ReportPlace, ReportSeverity } from '../lib/schemas/report'
import { AdminAuditEntry, Invitation, OutgoingMail, Pattern, PatternRevision, Report, ReportMessage, ReportPhoto, User } from '../models'
import type { ReportAuthorRole } from '../models/report-message'
import { seedDemoCovers } from './demo-covers'
import { storeDemoPhotos, type DemoPhoto } from './demo-photos'
import type { AdminAction } from '../models/admin-audit-entry'
import { hollyberryWreath } from './demo-wreath'
import { DEMO_SEASON_PATTERNS, DEMO_WREATH_SKILL_NOTES, seedSeasonSales } from './demo-season'

/** For the demo only: every demo account signs in with this password. */
export const DEMO_PASSWORD = 'stitch-and-flip-26'

interface DemoPerson {
  readonly email: string
  readonly displayName: string
  readonly roles: Role[]
  /** What `npm run demo` prints beside the address. */
  readonly note: string
  /** Not yet verified their e-mail address (the banner shows). */
  readonly unverified?: true
  /** Asked for a designer account this many days ago; an admin has not decided yet. */
  readonly designerRequestedDaysAgo?: number
  /** Disabled by the admin this many days ago. */
  readonly disabledDaysAgo?: number
}

/** The people worth signing in as, printed by `npm run demo`. */
export const DEMO_PEOPLE: readonly DemoPerson[] = [
  { email: 'odile@wreathwright.example', displayName: 'Odile Fairweather', roles: ['admin'], note: 'admin (the admin desk: /admin)' },
  { email: 'marguerite@bramblelane.example', displayName: 'Marguerite Okafor', roles: ['designer', 'quilter'], note: 'designer, Bramble Lane Quiltworks' },
  { email: 'tomasz@juniperthread.example', displayName: 'Tomasz Lindqvist', roles: ['designer', 'quilter'], note: 'designer, Juniper Thread Co.' },
  { email: 'priya@testers.example', displayName: 'Priya Desmond', roles: ['tester', 'quilter'], note: 'pattern tester of Lantern Medallion (reports with photos and threads)' },
  { email: 'hana@testers.example', displayName: 'Hana Kowalczyk', roles: ['quilter'], note: 'second tester of Lantern Medallion' },
  { email: 'elsie@quilters.example', displayName: 'Elsie Varga', roles: ['quilter'], note: 'quilter' },
  { email: 'ruben@quilters.example', displayName: 'Ruben Achterberg', roles: ['quilter'], note: 'quilter' },
  {
    email: 'isadora@fernhollow.example',
    displayName: 'Isadora Quennell',
    roles: ['quilter'],
    note: 'quilter waiting for a designer account (a request on the admin desk)',
    designerRequestedDaysAgo: 3,
  },
  { email: 'bastien@quilters.example', displayName: 'Bastien Marlowe', roles: ['quilter'], note: 'quilter who has not verified his address yet', unverified: true },
]

/** More people in the states the admin desk shows, not worth printing: a second request, a disabled account. */
export const DEMO_PEOPLE_IN_STATES: readonly DemoPerson[] = [
  { email: 'wilhelmina@loomandleaf.example', displayName: 'Wilhelmina Thorne', roles: ['quilter'], note: 'waiting for a designer account', designerRequestedDaysAgo: 1 },
  { email: 'corentin@quilters.example', displayName: 'Corentin Ashby', roles: ['quilter'], note: 'disabled', disabledDaysAgo: 12 },
]

/** Generated quilters for the admin desk's paging: invented first and last names, paired without repeats. */
export const DEMO_CROWD_SIZE = 300
const CROWD_FIRST_NAMES = [
  'Agnes', 'Anselm', 'Beatrix', 'Cosmo', 'Delphine', 'Emrys', 'Florence', 'Gideon', 'Hester', 'Ivo',
  'Juno', 'Kasimir', 'Liesel', 'Mabon', 'Nerys', 'Orla', 'Perpetua', 'Quentin', 'Rosalind', 'Silas',
  'Tamsin', 'Ulric', 'Verity', 'Wystan', 'Xanthe', 'Yorick', 'Zinnia', 'Bronwen', 'Lorcan', 'Maud',
]
const CROWD_LAST_NAMES = [
  'Abernethy', 'Blackthorn', 'Cresswell', 'Dunstable', 'Elderkin', 'Fairbairn', 'Gorseway', 'Hawthorne', 'Ingleby', 'Juniper',
  'Kettlewell', 'Larkspur', 'Mallowby', 'Nettlefold', 'Oakhurst', 'Pennyroyal', 'Quarrington', 'Rushbrook', 'Sallowfield', 'Thistlewood',
  'Underhay', 'Vetchley', 'Willowmere', 'Yarrowby', 'Ashcombe', 'Brackenridge', 'Cloverdale', 'Dimmock', 'Fernleigh', 'Heathcote',
]
const CROWD_DOMAINS = ['quilters.example', 'sewing-circle.example', 'patchwork-guild.example', 'thimble.example']

/**
 * The generated crowd: person `i` pairs first name `i mod 30` with last name `(i div 30 + i) mod 30`,
 * so no pair repeats in 300. Every sixth has not verified their address, every twentieth tests
 * patterns; they joined one every two days, most recent first.
 *
 * @example demoCrowd()[1].email // 'anselm.blackthorn@sewing-circle.example'
 */
export function demoCrowd(): { email: string; displayName: string; roles: Role[]; verified: boolean; joinedDaysAgo: number }[] {
  return Array.from({ length: DEMO_CROWD_SIZE }, (_, i) => {
    const first = CROWD_FIRST_NAMES[i % CROWD_FIRST_NAMES.length]!
    const last = CROWD_LAST_NAMES[(Math.floor(i / CROWD_FIRST_NAMES.length) + i) % CROWD_LAST_NAMES.length]!
    return {
      email: `${first}.${last}@${CROWD_DOMAINS[i % CROWD_DOMAINS.length]}`.toLowerCase(),
      displayName: `${first} ${last}`,
      roles: i % 20 === 7 ? ['tester', 'quilter'] : ['quilter'],
      verified: i % 6 !== 5,
      joinedDaysAgo: 5 + i * 2,
    }
  })
}

/**
 * What the admin desk's logs would already hold after this history: each entry is written when
 * the person it concerns is created, so a second run adds none.
 */
const DEMO_AUDIT: readonly { target: string; action: AdminAction; details: Record<string, unknown>; daysAgo: number }[] = [
  { target: 'tomasz@juniperthread.example', action: 'approve-designer-request', details: {}, daysAgo: 40 },
  { target: 'priya@testers.example', action: 'grant-role', details: { role: 'tester' }, daysAgo: 30 },
  { target: 'corentin@quilters.example', action: 'disable-account', details: {}, daysAgo: 12 },
]
const DEMO_MAIL: readonly { to: string; kind: MailKind; state: 'sent' | 'failed'; daysAgo: number; lastError?: string }[] = [
  { to: 'tomasz@juniperthread.example', kind: 'designer-request-decided', state: 'sent', daysAgo: 40 },
  { to: 'bastien@quilters.example', kind: 'verify-email', state: 'sent', daysAgo: 2 },
  // A message the receiving server refused every time: how a failure looks in the mail log.
  { to: 'corentin@quilters.example', kind: 'password-reset', state: 'failed', daysAgo: 13, lastError: '550 5.1.1 The recipient’s mailbox is unavailable' },
]

const daysAgo = (days: number, now = Date.now()) => new Date(now - days * 24 * 60 * 60 * 1000)

const cos = (degrees: number) => Math.cos((degrees * Math.PI) / 180)
const sin = (degrees: number) => Math.sin((degrees * Math.PI) / 180)
/** A point at `radius` inches and `degrees` from +x, rounded to 1/10000 in. */
const polar = (radius: number, degrees: number): [number, number] => [
  Math.round(radius * cos(degrees) * 10_000) / 10_000,
  Math.round(radius * sin(degrees) * 10_000) / 10_000,
]

/** Sixths with a centre opening, alternately mirrored: two bands and a split outer area. */
const lanternMedallion: DesignFile = {
  format: 'wreathwright-design',
  version: 2,
  name: 'Lantern Medallion',
  units: 'in',
  ring: { innerRadius: 3, outerRadius: 10, repeats: 6, repeatMode: 'mirror' },
  seams: [
    { id: 'inner-band', from: [6, 0], to: polar(6, 60) },
    { id: 'outer-band', from: [8.5, 0], to: polar(8.5, 60) },
    { id: 'divide', from: polar(8.5 * cos(30), 30), to: polar(10, 30) },
  ],
  fills: [
    { at: polar(4.5, 30), fabric: 'glow' },
    { at: polar(7, 30), fabric: 'frame' },
    { at: polar(9.2, 12), fabric: 'sky' },
    { at: polar(9.2, 48), fabric: 'sky' },
  ],
  leaves: [],
  stems: [],
  berries: [],
  curls: [],
  // Fabric names are invented for the demo: descriptions a shop might use, not real products.
  colorways: [
    {
      name: 'Harvest',
      fabrics: {
        glow: { name: 'Marigold crackle print', color: '#e9b44c' },
        frame: { name: 'Brick red homespun', color: '#9b2915' },
        sky: { name: 'Midnight ink solid', color: '#1d3557' },
        binding: { name: 'Brick red homespun', color: '#9b2915' },
      },
    },
    {
      name: 'Sea glass',
      fabrics: {
        glow: { name: 'Seafoam watercolour batik', color: '#cfe8e3' },
        frame: { name: 'Harbour teal linen-look', color: '#4f8a8b' },
        sky: { name: 'Sandbar cream tone-on-tone', color: '#f6f1e7' },
        binding: { name: 'Driftwood grey stripe', color: '#7d7f7c' },
      },
    },
  ],
  order: null,
}

/** Eighths of a 16 in ring meeting at the centre. */
const compassRing: DesignFile = {
  format: 'wreathwright-design',
  version: 2,
  name: 'Eightfold Compass Ring',
  units: 'in',
  ring: { innerRadius: 0, outerRadius: 8, repeats: 8, repeatMode: 'rotate' },
  seams: [
    { id: 'hub', from: [3, 0], to: polar(3, 45) },
    { id: 'ring', from: [5.5, 0], to: polar(5.5, 45) },
    { id: 'point', from: polar(5.5 * cos(22.5), 22.5), to: polar(8, 22.5) },
  ],
  fills: [
    { at: polar(1.5, 22.5), fabric: 'hub' },
    { at: polar(4.2, 22.5), fabric: 'ring' },
    { at: polar(7, 10), fabric: 'light' },
    { at: polar(7, 35), fabric: 'dark' },
  ],
  leaves: [],
  stems: [],
  berries: [],
  curls: [],
  colorways: [
    {
      name: 'Indigo',
      fabrics: {
        hub: { name: 'Saffron pin dot', color: '#f2c14e' },
        ring: { name: 'Deep lagoon solid', color: '#264653' },
        light: { name: 'Snowberry white tone-on-tone', color: '#f1faee' },
        dark: { name: 'Indigo night shibori print', color: '#1d3557' },
        binding: { name: 'Indigo night shibori print', color: '#1d3557' },
      },
    },
    {
      name: 'Rosehip',
      fabrics: {
        hub: { name: 'Rosehip red small check', color: '#b23a48' },
        ring: { name: 'Moss green shot cotton', color: '#5b7553' },
        light: { name: 'Oatmeal linen-look', color: '#efe6d5' },
        dark: { name: 'Plum wine crossweave', color: '#5c2a4a' },
        binding: { name: 'Moss green shot cotton', color: '#5b7553' },
      },
    },
  ],
  order: null,
}

/** A sketch: an empty ring in sixths, its background chosen in two colourways already. */
const winterStarSketch: DesignFile = {
  ...emptyDesign('Winter Star (sketch)', { innerRadius: 0, outerRadius: 10, repeats: 6, repeatMode: 'rotate' }),
  colorways: [
    {
      name: 'Frost',
      fabrics: { background: { name: 'Snowberry white tone-on-tone', color: '#f4f6f4' }, binding: { name: 'Glacier blue crossweave', color: '#8fb0c8' } },
    },
    {
      name: 'Ember',
      fabrics: { background: { name: 'Cinnamon stick tonal', color: '#8a4b2f' }, binding: { name: 'Charcoal ember solid', color: '#3a3332' } },
    },
  ],
}

/**
 * A pattern that is or was for sale carries its price, in integer cents; the season's patterns on
 * sale (scripts/demo-season.ts) come after the studios' own.
 */
export const DEMO_PATTERNS: readonly { owner: string; state: PatternState; design: DesignFile; priceCents?: number; currency?: PatternCurrency; skillNotes?: string }[] = [
  { owner: 'marguerite@bramblelane.example', state: 'published', design: hollyberryWreath, priceCents: 1400, currency: 'USD', skillNotes: DEMO_WREATH_SKILL_NOTES },
  { owner: 'marguerite@bramblelane.example', state: 'testing', design: lanternMedallion },
  { owner: 'marguerite@bramblelane.example', state: 'draft', design: winterStarSketch },
  { owner: 'tomasz@juniperthread.example', state: 'draft', design: compassRing },
  {
    owner: 'tomasz@juniperthread.example',
    state: 'retired',
    design: { ...compassRing, name: 'Sunday Ring', ring: { ...compassRing.ring, repeats: 8 } },
    priceCents: 1150,
    currency: 'EUR',
  },
  ...DEMO_SEASON_PATTERNS.map((pattern) => ({ ...pattern, state: 'published' as const })),
]

/** Creates the generated crowd's missing members in one insert; returns how many were added. */
async function seedCrowd(passwordHash: string, transaction: Transaction): Promise<number> {
  const crowd = demoCrowd()
  const existing = await User.findAll({ where: { email: { [Op.in]: crowd.map((person) => person.email) } }, attributes: ['email'], transaction })
  const taken = new Set(existing.map((user) => user.email))
  const now = Date.now()
  const missing = crowd
    .filter((person) => !taken.has(person.email))
    .map((person) => ({
      email: person.email,
      displayName: person.displayName,
      roles: person.roles,
      passwordHash,
      emailVerifiedAt: person.verified ? daysAgo(person.joinedDaysAgo, now) : null,
      designerRequestedAt: null,
      createdAt: daysAgo(person.joinedDaysAgo, now),
    }))
  await User.bulkCreate(missing, { transaction })
  return missing.length
}

/** Loads the demo people and patterns into the database named by DATABASE_URL; safe to repeat. */
export async function seedDemoData(): Promise<{ people: number; patterns: number; reports: number; sales: number }> {
  const sequelize = database()
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  let people = 0
  let patterns = 0
  let reports = 0
  let sales = 0
  await sequelize.transaction(async (transaction) => {
    const owners = new Map<string, User>()
    const created = new Set<string>()
    for (const person of [...DEMO_PEOPLE, ...DEMO_PEOPLE_IN_STATES]) {
      const [user, isNew] = await User.findOrCreate({
        where: { email: person.email },
        defaults: {
          email: person.email,
          displayName: person.displayName,
          roles: person.roles,
          passwordHash,
          emailVerifiedAt: person.unverified ? null : daysAgo(60),
          designerRequestedAt: person.designerRequestedDaysAgo === undefined ? null : daysAgo(person.designerRequestedDaysAgo),
          disabledAt: person.disabledDaysAgo === undefined ? null : daysAgo(person.disabledDaysAgo),
          createdAt: daysAgo(60),
        },
        transaction,
      })
      if (isNew) {
        people += 1
        created.add(person.email)
      }
      owners.set(person.email, user)
    }
    people += await seedCrowd(passwordHash, transaction)

    const admin = owners.get(DEMO_PEOPLE[0]!.email)!
    const label = (user: User) => `${user.displayName} <${user.email}>`
    for (const entry of DEMO_AUDIT.filter((entry) => created.has(entry.target))) {
      const target = owners.get(entry.target)!
      await AdminAuditEntry.create(
        { actorId: admin.id, actorLabel: label(admin), action: entry.action, targetId: target.id, targetLabel: label(target), details: entry.details, createdAt: daysAgo(entry.daysAgo) },
        { transaction },
      )
    }
    for (const mail of DEMO_MAIL.filter((mail) => created.has(mail.to))) {
      const at = daysAgo(mail.daysAgo)
      await OutgoingMail.create(
        {
          toAddress: mail.to,
          kind: mail.kind,
          state: mail.state,
          attempts: mail.state === 'sent' ? 1 : 7,
          lastError: mail.lastError ?? null,
          userId: owners.get(mail.to)!.id,
          createdAt: at,
          sentAt: mail.state === 'sent' ? at : null,
        },
        { transaction },
      )
    }

    for (const demo of DEMO_PATTERNS) {
      const design = designFileSchema.parse(demo.design)
      const owner = owners.get(demo.owner)!
      const [pattern, isNew] = await Pattern.findOrCreate({
        where: { ownerId: owner.id, name: design.name },
        defaults: {
          ownerId: owner.id,
          name: design.name,
          state: demo.state,
          design,
          revision: 1,
          priceCents: demo.priceCents ?? null,
          currency: demo.currency ?? null,
          skillNotes: demo.skillNotes ?? null,
        },
        transaction,
      })
      if (!isNew) continue
      patterns += 1
      await PatternRevision.create(
        { patternId: pattern.id, revision: 1, name: pattern.name, state: pattern.state, design, savedById: owner.id },
        { transaction },
      )
    }
    reports = await seedTestRound(owners, transaction)
    sales = await seedSeasonSales(transaction)
    // Two of the season's patterns show an uploaded cover in the shop (generated pictures).
    await seedDemoCovers(transaction)
  })
  return { people, patterns, reports, sales }
}

/** The test round of the pattern in testing: who was invited, and what they reported. */
export const DEMO_TEST_ROUND = {
  designer: 'marguerite@bramblelane.example',
  pattern: 'Lantern Medallion',
  /** Accepted invitations: testers now. */
  testers: ['priya@testers.example', 'hana@testers.example'],
  /** Sent but not yet taken up (no account with this address yet). */
  pendingInvitations: ['felix@sewing-circle.example'],
} as const

interface DemoReport {
  readonly tester: string
  readonly kind: ReportKind
  readonly severity: ReportSeverity
  readonly text: string
  readonly place: ReportPlace
  readonly state: 'open' | 'resolved'
  readonly daysAgo: number
  readonly photos: readonly DemoPhoto[]
  readonly thread: readonly { readonly from: string; readonly role: ReportAuthorRole; readonly text: string; readonly daysAgo: number }[]
}

export const DEMO_REPORTS: readonly DemoReport[] = [
  {
    tester: 'priya@testers.example',
    kind: 'cutting',
    severity: 'blocks-sewing',
    text: 'The rough-cut piece for A3 comes out about 1/4 in short along the outer arc: after flipping it, the seam allowance at the edge of the ring is not covered.',
    place: { area: 'A3' },
    state: 'open',
    daysAgo: 6,
    photos: [{ base: '#8a4b2f', band: '#e8dcc4' }],
    thread: [
      { from: 'marguerite@bramblelane.example', role: 'designer', text: 'Thank you! Which paper did you print on, and did the 1 in test square measure true?', daysAgo: 5 },
      { from: 'priya@testers.example', role: 'tester', text: 'US Letter, and the test square was exactly 1 in. The photo shows the gap at the outer edge.', daysAgo: 5 },
    ],
  },
  {
    tester: 'priya@testers.example',
    kind: 'printing',
    severity: 'minor',
    text: 'On page 2 the cutting list names the background fabric twice.',
    place: { page: 2 },
    state: 'resolved',
    daysAgo: 8,
    photos: [],
    thread: [{ from: 'marguerite@bramblelane.example', role: 'designer', text: 'Well spotted: the second line was the binding. Fixed for the next booklet.', daysAgo: 7 }],
  },
  {
    tester: 'hana@testers.example',
    kind: 'instructions',
    severity: 'needs-fixing',
    text: 'Step 2 says to sew A2 next, but I could not tell which edge of A1 it is sewn along until I held the foundation up to the light.',
    place: { step: 2 },
    state: 'open',
    daysAgo: 4,
    photos: [{ base: '#2f5d50', band: '#d9a441' }, { base: '#3b4f7a', band: '#e8dcc4' }],
    thread: [],
  },
  {
    tester: 'hana@testers.example',
    kind: 'fit',
    severity: 'minor',
    text: 'Where the three seams meet here the block gets bulky; pressing these seams open might help.',
    place: { point: [6.1, 5.8] },
    state: 'open',
    daysAgo: 3,
    photos: [],
    thread: [{ from: 'marguerite@bramblelane.example', role: 'designer', text: 'Good idea: I will add a pressing note to that step.', daysAgo: 2 }],
  },
]

/**
 * Invites the demo's testers to the pattern in testing and files their reports, with threads and
 * generated photos, unless the pattern already has invitations or reports. Returns the reports added.
 */
async function seedTestRound(people: ReadonlyMap<string, User>, transaction: Transaction): Promise<number> {
  const designer = people.get(DEMO_TEST_ROUND.designer)!
  const pattern = await Pattern.findOne({ where: { ownerId: designer.id, name: DEMO_TEST_ROUND.pattern }, transaction })
  if (!pattern) return 0
  if ((await Invitation.count({ where: { patternId: pattern.id }, transaction })) === 0) {
    for (const email of DEMO_TEST_ROUND.testers) {
      const tester = people.get(email)!
      await Invitation.create(
        { patternId: pattern.id, email, invitedById: designer.id, userId: tester.id, acceptedAt: daysAgo(9), withdrawnAt: null, expiresAt: daysAgo(-21), createdAt: daysAgo(10) },
        { transaction },
      )
    }
    for (const email of DEMO_TEST_ROUND.pendingInvitations) {
      await Invitation.create({ patternId: pattern.id, email, invitedById: designer.id, userId: null, acceptedAt: null, withdrawnAt: null, expiresAt: daysAgo(-28), createdAt: daysAgo(2) }, { transaction })
    }
  }
  if ((await Report.count({ where: { patternId: pattern.id }, transaction })) > 0) return 0
  const parsed = parseDesign(pattern.design)
  const plan = parsed.ok ? planDesign(parsed.design, { suggestions: false }) : null
  for (const demo of DEMO_REPORTS) {
    const tester = people.get(demo.tester)!
    const at = daysAgo(demo.daysAgo)
    const lastAt = demo.thread.length > 0 ? daysAgo(demo.thread.at(-1)!.daysAgo) : at
    const report = await Report.create(
      {
        patternId: pattern.id,
        testerId: tester.id,
        kind: demo.kind,
        severity: demo.severity,
        text: demo.text,
        place: demo.place,
        pin: plan && parsed.ok ? pinOf(demo.place, plan, parsed.design.ring) : null,
        state: demo.state,
        revision: pattern.revision,
        createdAt: at,
        updatedAt: lastAt,
      },
      { transaction, silent: true },
    )
    for (const message of demo.thread) {
      await ReportMessage.create({ reportId: report.id, authorId: people.get(message.from)!.id, authorRole: message.role, text: message.text, createdAt: daysAgo(message.daysAgo) }, { transaction })
    }
    const photoIds = demo.photos.length > 0 ? await storeDemoPhotos(tester.id, demo.photos, transaction) : []
    await ReportPhoto.bulkCreate((photoIds ?? []).map((uploadId, position) => ({ reportId: report.id, uploadId, position })), { transaction })
  }
  return DEMO_REPORTS.length
}
