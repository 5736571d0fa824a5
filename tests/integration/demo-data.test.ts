import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { parseDesign } from '@/lib/schemas/design'
import { Pattern, PatternRevision, User } from '@/models'
import { DEMO_PATTERNS, DEMO_PEOPLE, seedDemoData } from '@/scripts/demo-data'
import { closeDatabase, freshDatabase } from '../support/database'

beforeEach(freshDatabase)
afterAll(closeDatabase)

describe('demo data', () => {
  it('loads every demo person and pattern, each pattern with its first revision', async () => {
    const loaded = await seedDemoData()
    expect(loaded).toEqual({ people: DEMO_PEOPLE.length, patterns: DEMO_PATTERNS.length })
    expect(await User.count()).toBe(DEMO_PEOPLE.length)
    expect(await PatternRevision.count()).toBe(DEMO_PATTERNS.length)
    const states = (await Pattern.findAll()).map((pattern) => pattern.state).sort()
    expect(states).toEqual(['draft', 'draft', 'published', 'retired', 'testing'])
  })

  it('neither duplicates nor overwrites anything when loaded again', async () => {
    await seedDemoData()
    const wreath = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
    await wreath!.update({ revision: 7, design: { ...(wreath!.design as object), seams: [] } })
    expect(await seedDemoData()).toEqual({ people: 0, patterns: 0 })
    expect(await User.count()).toBe(DEMO_PEOPLE.length)
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
})
