/**
 * Demo data: an invented scenario. Two small studios — Bramble Lane Quiltworks (Marguerite Okafor)
 * and Juniper Thread Co. (Tomasz Lindqvist) — a pattern tester, two quilters and an admin.
 * Loading is idempotent: people are found by e-mail and patterns by owner and name, so a second
 * run neither duplicates nor overwrites anything a person changed in the meantime.
 */
import { hashPassword } from '../lib/auth/password'
import { database } from '../lib/db'
import { emptyDesign } from '../lib/new-design'
import type { Role } from '../lib/roles'
import type { DesignFile } from '../lib/schemas/design'
import { designFileSchema } from '../lib/schemas/design'
import type { PatternState } from '../lib/schemas/pattern'
import { Pattern, PatternRevision, User } from '../models'
import { hollyberryWreath } from './demo-wreath'

/** For the demo only: every demo account signs in with this password. */
export const DEMO_PASSWORD = 'stitch-and-flip-26'

export const DEMO_PEOPLE: readonly { email: string; displayName: string; roles: Role[]; note: string }[] = [
  { email: 'odile@wreathwright.example', displayName: 'Odile Fairweather', roles: ['admin'], note: 'admin' },
  { email: 'marguerite@bramblelane.example', displayName: 'Marguerite Okafor', roles: ['designer', 'quilter'], note: 'designer, Bramble Lane Quiltworks' },
  { email: 'tomasz@juniperthread.example', displayName: 'Tomasz Lindqvist', roles: ['designer', 'quilter'], note: 'designer, Juniper Thread Co.' },
  { email: 'priya@testers.example', displayName: 'Priya Desmond', roles: ['tester', 'quilter'], note: 'pattern tester' },
  { email: 'elsie@quilters.example', displayName: 'Elsie Varga', roles: ['quilter'], note: 'quilter' },
  { email: 'ruben@quilters.example', displayName: 'Ruben Achterberg', roles: ['quilter'], note: 'quilter' },
]

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

export const DEMO_PATTERNS: readonly { owner: string; state: PatternState; design: DesignFile }[] = [
  { owner: 'marguerite@bramblelane.example', state: 'published', design: hollyberryWreath },
  { owner: 'marguerite@bramblelane.example', state: 'testing', design: lanternMedallion },
  { owner: 'marguerite@bramblelane.example', state: 'draft', design: winterStarSketch },
  { owner: 'tomasz@juniperthread.example', state: 'draft', design: compassRing },
  {
    owner: 'tomasz@juniperthread.example',
    state: 'retired',
    design: { ...compassRing, name: 'Sunday Ring', ring: { ...compassRing.ring, repeats: 8 } },
  },
]

/** Loads the demo people and patterns into the database named by DATABASE_URL; safe to repeat. */
export async function seedDemoData(): Promise<{ people: number; patterns: number }> {
  const sequelize = database()
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  let people = 0
  let patterns = 0
  await sequelize.transaction(async (transaction) => {
    const owners = new Map<string, User>()
    for (const person of DEMO_PEOPLE) {
      const [user, created] = await User.findOrCreate({
        where: { email: person.email },
        defaults: { email: person.email, displayName: person.displayName, roles: person.roles, passwordHash, emailVerifiedAt: new Date(), designerRequestedAt: null },
        transaction,
      })
      if (created) people += 1
      owners.set(person.email, user)
    }
    for (const demo of DEMO_PATTERNS) {
      const design = designFileSchema.parse(demo.design)
      const owner = owners.get(demo.owner)!
      const [pattern, created] = await Pattern.findOrCreate({
        where: { ownerId: owner.id, name: design.name },
        defaults: { ownerId: owner.id, name: design.name, state: demo.state, design, revision: 1 },
        transaction,
      })
      if (!created) continue
      patterns += 1
      await PatternRevision.create(
        { patternId: pattern.id, revision: 1, name: pattern.name, state: pattern.state, design, savedById: owner.id },
        { transaction },
      )
    }
  })
  return { people, patterns }
}
