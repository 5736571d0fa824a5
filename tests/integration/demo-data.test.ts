import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { parseDesign } from '@/lib/schemas/design'
import { Op } from 'sequelize'
import { AdminAuditEntry, OutgoingMail, Pattern, PatternRevision, User } from '@/models'
import { DEMO_CROWD_SIZE, DEMO_PATTERNS, DEMO_PEOPLE, DEMO_PEOPLE_IN_STATES, demoCrowd, seedDemoData } from '@/scripts/demo-data'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'

beforeEach(async () => {
  await freshDatabase()
  await emptyAdminLogs()
})
afterAll(closeDatabase)

/** Everyone the demo makes: the people to sign in as, the people in other states, the generated crowd. */
const EVERYONE = DEMO_PEOPLE.length + DEMO_PEOPLE_IN_STATES.length + DEMO_CROWD_SIZE

describe('demo data', () => {
  it('loads every demo person and pattern, each pattern with its first revision', async () => {
    const loaded = await seedDemoData()
    expect(loaded).toEqual({ people: EVERYONE, patterns: DEMO_PATTERNS.length })
    expect(await User.count()).toBe(EVERYONE)
    expect(await PatternRevision.count()).toBe(DEMO_PATTERNS.length)
    const states = (await Pattern.findAll()).map((pattern) => pattern.state).sort()
    expect(states).toEqual(['draft', 'draft', 'published', 'retired', 'testing'])
  })

  it('neither duplicates nor overwrites anything when loaded again', async () => {
    await seedDemoData()
    const wreath = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
    await wreath!.update({ revision: 7, design: { ...(wreath!.design as object), seams: [] } })
    const entries = await AdminAuditEntry.count()
    const mail = await OutgoingMail.count()
    expect(await seedDemoData()).toEqual({ people: 0, patterns: 0 })
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
})
