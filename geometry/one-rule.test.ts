/**
 * One rule, one place: the point type, point-in-polygon and section letters are each written once
 * (geometry/types.ts, polygon-measure.ts, plan.ts) and used everywhere else, so the fabric maths
 * and the shop cannot copy a second version. These tests read the source to keep it that way.
 */
import { readdirSync, readFileSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { describe, expect, it } from 'vitest'
import { sectionLetter } from './plan'

const root = join(import.meta.dirname, '..')

function sourceFiles(folder: string): string[] {
  return readdirSync(folder).flatMap((name) => {
    const path = join(folder, name)
    if (statSync(path).isDirectory()) return name === 'node_modules' || name === 'fixtures' || name === 'test-support' ? [] : sourceFiles(path)
    return /\.tsx?$/.test(name) && !/\.test\.tsx?$/.test(name) ? [path] : []
  })
}

/** Lines of the app's code (geometry, lib, components, app) matching `pattern`, as file:line. */
function linesMatching(pattern: RegExp): string[] {
  const found: string[] = []
  for (const folder of ['geometry', 'lib', 'components', 'app']) {
    for (const file of sourceFiles(join(root, folder))) {
      readFileSync(file, 'utf8').split('\n').forEach((line, index) => {
        if (pattern.test(line)) found.push(`${relative(root, file)}:${index + 1}`)
      })
    }
  }
  return found
}

describe('one rule, one place', () => {
  it('declares the point type once, in geometry/types.ts', () => {
    const declarations = linesMatching(/^\s*(export\s+)?type\s+\w*(Point|XY|Vec2)\w*\s*=\s*(readonly\s*)?\[/)
    expect(declarations).toEqual([expect.stringMatching(/^geometry\/types\.ts:/)])
  })

  it('tests points in polygons with one function (isPointInPolygon)', () => {
    // the even-odd crossing toggle written out; polygon-measure.ts holds the one copy
    expect(linesMatching(/inside = !inside/)).toEqual([expect.stringMatching(/^geometry\/polygon-measure\.ts:/)])
  })

  it('makes section letters in one place, A … Z then AA, AB', () => {
    expect(linesMatching(/fromCharCode\(\s*65/)).toEqual([expect.stringMatching(/^geometry\/plan\.ts:/)])
    // spreadsheet-style letters after Z (from memory: common for many sections): the 27th is AA
    expect(sectionLetter(26)).toBe('AA')
    expect(sectionLetter(27)).toBe('AB')
    expect(sectionLetter(26 + 26 * 26)).toBe('AAA')
  })
})
