import fs from 'node:fs'
import path from 'node:path'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..')

/** Every route handler under app/api as the README writes its path: `app/api/reports/[id]` → `/api/reports/:id`. */
function apiRoutes(folder = path.join(root, 'app', 'api')): string[] {
  return fs.readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const inside = path.join(folder, entry.name)
    if (entry.isDirectory()) return apiRoutes(inside)
    if (entry.name !== 'route.ts') return []
    return ['/' + path.relative(path.join(root, 'app'), folder).split(path.sep).join('/').replace(/\[(\w+)\]/g, ':$1')]
  })
}

describe("the README's API table", () => {
  it('names every route handler by its whole path', () => {
    const readme = fs.readFileSync(path.join(root, 'README.md'), 'utf8')
    const table = readme.slice(readme.indexOf('### API'), readme.indexOf('## Security'))
    const escape = (text: string) => text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
    const missing = apiRoutes().filter((route) => !new RegExp(`${escape(route)}(?![\\w/-])`).test(table))
    expect(missing).toEqual([])
  })
})
