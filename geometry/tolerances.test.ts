import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'

const root = join(import.meta.dirname, '..')

function sourceFiles(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name)
    if (statSync(path).isDirectory()) return name === 'fixtures' || name === 'test-support' ? [] : sourceFiles(path)
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [path] : []
  })
}

describe('one tolerance policy', () => {
  it('names every epsilon in tolerances.ts: no bare 1e-9 in the code of geometry/ or lib/', () => {
    // style.md: "No bare 1e-9 elsewhere"; comments and doc examples may show values.
    const bare = /(?<![\w.])\d+(\.\d+)?e-\d+/
    const found: string[] = []
    for (const file of [...sourceFiles(join(root, 'geometry')), ...sourceFiles(join(root, 'lib'))]) {
      if (file.endsWith(join('geometry', 'tolerances.ts'))) continue
      readFileSync(file, 'utf8').split('\n').forEach((line, index) => {
        const code = line.trim()
        if (code.startsWith('*') || code.startsWith('//') || code.startsWith('/*')) return
        if (bare.test(code.replace(/\/\/.*$/, ''))) found.push(`${relative(root, file)}:${index + 1}: ${code}`)
      })
    }
    expect(found).toEqual([])
  })

  it('keeps the allowance tolerances in the same file as the others', () => {
    expect(readdirSync(import.meta.dirname)).not.toContain('allowance-tolerances.ts')
  })
})
