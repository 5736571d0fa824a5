/**
 * Fixture folders, each named for what it shows, with the design and the plan expected for it.
 * REGEN=1 rewrites the expected plans (read the diff before committing it). A known failure
 * stays as `broken-<reason>` and is skipped by name, never deleted.
 */
import { existsSync, readdirSync, readFileSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { parseDesign } from '../lib/schemas/design'
import { planDesign } from './plan'

const root = join(import.meta.dirname, 'fixtures')
const folders = readdirSync(root, { withFileTypes: true })
  .filter((entry) => entry.isDirectory() && existsSync(join(root, entry.name, 'design.json')))
  .map((entry) => entry.name)
  .sort()

describe('fixtures', () => {
  for (const folder of folders) {
    const run = folder.startsWith('broken-') ? it.skip : it
    run(folder, () => {
      const parsed = parseDesign(JSON.parse(readFileSync(join(root, folder, 'design.json'), 'utf8')))
      expect(parsed.ok).toBe(true)
      if (!parsed.ok) return
      const plan = JSON.parse(JSON.stringify(planDesign(parsed.design)))
      const expectedPath = join(root, folder, 'plan.json')
      if (process.env.REGEN === '1' || !existsSync(expectedPath)) writeFileSync(expectedPath, `${JSON.stringify(plan, null, 2)}\n`)
      expect(plan).toEqual(JSON.parse(readFileSync(expectedPath, 'utf8')))
    })
  }
})
