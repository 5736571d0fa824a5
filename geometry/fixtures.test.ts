/**
 * Fixture folders, each named for what it shows, with the design and the plan expected for it.
 * REGEN=1 writes the expected plans (read the diff before committing it); without it a folder
 * with no plan.json fails. A known failure stays as `broken-<reason>` and is skipped by name,
 * never deleted.
 */
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { parseDesign } from '../lib/schemas/design'
import { expectedFromFile } from './fixtures/expected-file'
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
      expect(plan).toEqual(expectedFromFile(join(root, folder, 'plan.json'), plan))
    })
  }
})
