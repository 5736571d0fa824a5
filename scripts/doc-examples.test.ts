/**
 * Doc-comment examples are right. Every one-line `@example call(...) // value` in geometry/, lib/
 * and scripts/ whose call uses only literals and the file's own exports is run, and its result is
 * compared with the value written after `//` (a number to the digits it shows; `≈` allows rounding
 * error). Examples that need a variable from elsewhere (`model`, `context`) are read by people only.
 */
import fs from 'node:fs'
import path from 'node:path'
import { pathToFileURL } from 'node:url'
import { describe, expect, it } from 'vitest'

const root = path.resolve(import.meta.dirname, '..')
const folders = ['geometry', 'lib', 'scripts']

interface Example {
  file: string
  line: number
  call: string
  expected: unknown
  approximate: boolean
}

/** Source text with its string literals emptied, to look for names outside them. */
const withoutStrings = (source: string) => source.replace(/'(?:[^'\\]|\\.)*'|"(?:[^"\\]|\\.)*"|`(?:[^`\\]|\\.)*`/g, "''")

/** The names a piece of source uses, less object keys, property names and arrow parameters. */
function namesUsed(source: string): string[] {
  const text = withoutStrings(source)
  const parameters = new Set([...text.matchAll(/\(\s*\[?\s*([\w$,\s]+?)\s*\]?\s*\)\s*=>|([\w$]+)\s*=>/g)]
    .flatMap((match) => (match[1] ?? match[2] ?? '').split(',').map((name) => name.trim())))
  return [...text.matchAll(/(?<![\w$.])([A-Za-z_$][\w$]*)(?![\w$])(?!\s*:)/g)]
    .map((match) => match[1]!)
    .filter((name) => !parameters.has(name))
}

const LITERAL_WORDS = new Set(['true', 'false', 'null', 'undefined', 'NaN', 'Infinity'])

/**
 * The value written after `//`: the longest run of its words that is a plain literal (so
 * `86 for an 18 in wedge ring` reads 86), or undefined when it starts with words.
 */
function readExpected(comment: string): { value: unknown; approximate: boolean } | undefined {
  const approximate = comment.trimStart().startsWith('≈')
  const words = comment.replace(/^\s*≈?\s*/, '').split(' ')
  for (let count = words.length; count > 0; count--) {
    const source = words.slice(0, count).join(' ').replace(/[,;:]$/, '')
    if (source === '' || source.includes('…')) continue
    if (namesUsed(source).some((name) => !LITERAL_WORDS.has(name))) continue
    try {
      return { value: new Function(`return (${source})`)(), approximate }
    } catch {
      // Not a whole literal yet (`[0,` of `[0, 0]`): try fewer words.
    }
  }
  return undefined
}

/** Exported names of a module, read from its source (functions, constants, classes, re-export lists). */
function exportedNames(source: string): Set<string> {
  const names = [...source.matchAll(/export\s+(?:async\s+)?(?:function\*?|const|let|class)\s+([\w$]+)/g)].map((m) => m[1]!)
  for (const list of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    names.push(...list[1]!.split(',').map((item) => item.trim().split(/\s+as\s+/).at(-1)!.replace(/^type\s+/, '')))
  }
  return new Set(names.filter(Boolean))
}

function findExamples(file: string): Example[] {
  const source = fs.readFileSync(file, 'utf8')
  const exports = exportedNames(source)
  const examples: Example[] = []
  source.split('\n').forEach((text, index) => {
    const match = /@example\s+(.+?)\s+\/\/\s+(.+?)\s*(?:\*\/)?$/.exec(text)
    if (!match) return
    const [, call, comment] = match as unknown as [string, string, string]
    const used = namesUsed(call).filter((name) => !LITERAL_WORDS.has(name) && name !== 'Math')
    if (used.length === 0 || !used.every((name) => exports.has(name))) return
    const expected = readExpected(comment)
    if (!expected) return
    examples.push({ file: path.relative(root, file), line: index + 1, call, expected: expected.value, approximate: expected.approximate })
  })
  return examples
}

function sourceFiles(folder: string): string[] {
  return fs.readdirSync(folder, { withFileTypes: true }).flatMap((entry) => {
    const full = path.join(folder, entry.name)
    if (entry.isDirectory()) return entry.name === 'node_modules' ? [] : sourceFiles(full)
    return /\.tsx?$/.test(entry.name) && !/\.(test|d)\.tsx?$/.test(entry.name) ? [full] : []
  })
}

/** Digits after the point that a written number shows (86 → 0, 14.4 → 1). */
const decimals = (value: number) => (String(value).split('.')[1] ?? '').length

/** Whether `actual` matches what the example wrote: numbers to the digits shown, or to 1e-9 after `≈`. */
function matches(actual: unknown, expected: unknown, approximate: boolean): boolean {
  if (typeof expected === 'number' && typeof actual === 'number') {
    const places = decimals(expected)
    const tolerance = approximate ? 1e-9 : places > 0 ? 0.5 * 10 ** -places : 1e-9 * Math.max(1, Math.abs(expected))
    return Math.abs(actual - expected) <= tolerance + Number.EPSILON * Math.abs(expected)
  }
  if (Array.isArray(expected)) {
    return Array.isArray(actual) && actual.length === expected.length && expected.every((item, i) => matches(actual[i], item, approximate))
  }
  if (expected && typeof expected === 'object') {
    if (!actual || typeof actual !== 'object') return false
    const keys = Object.keys(expected)
    return keys.length === Object.keys(actual).length &&
      keys.every((key) => matches((actual as Record<string, unknown>)[key], (expected as Record<string, unknown>)[key], approximate))
  }
  return Object.is(actual, expected)
}

describe('reading the value an example promises', () => {
  it('takes the literal at the start of the comment and leaves the words after it', () => {
    expect(readExpected('86 for an 18 in wedge ring')).toEqual({ value: 86, approximate: false })
    expect(readExpected("'2 3/8 in'")).toEqual({ value: '2 3/8 in', approximate: false })
    expect(readExpected('≈ [0, 1]')).toEqual({ value: [0, 1], approximate: true })
    expect(readExpected('{ point: [4.02, 0], kind: \'outline\' }')).toEqual({ value: { point: [4.02, 0], kind: 'outline' }, approximate: false })
    expect(readExpected('0, or 2 for an invalid design')).toEqual({ value: 0, approximate: false })
  })

  it('checks nothing from a comment that is words or an elided value', () => {
    expect(readExpected('the printed trim line')).toBeUndefined()
    expect(readExpected("['A1', 'A2', …]")).toBeUndefined()
    expect(readExpected('π/2')).toBeUndefined()
  })

  it('compares numbers to the digits written', () => {
    expect(matches(14.4, 14.4, false)).toBe(true)
    expect(matches(14.43, 14.4, false)).toBe(true)
    expect(matches(67, 86, false)).toBe(false)
    expect(matches(595.2755905511812, 595.2755905511812, false)).toBe(true)
    expect(matches(2.0000000001, 2, true)).toBe(true)
    expect(matches(2.1, 2, false)).toBe(false)
  })
})

const examples = folders.flatMap((folder) => sourceFiles(path.join(root, folder))).flatMap(findExamples)

describe('doc-comment examples', () => {
  it('finds a good number of checkable examples (so a broken reader cannot pass by checking none)', () => {
    expect(examples.length).toBeGreaterThanOrEqual(20)
  })

  for (const example of examples) {
    it(`${example.file}:${example.line} ${example.call}`, async () => {
      const exports = (await import(pathToFileURL(path.join(root, example.file)).href)) as Record<string, unknown>
      const names = Object.keys(exports)
      // TypeScript's non-null `!` (`[0]!.length`) is not JavaScript: drop it before running the call.
      const call = example.call.replace(/!(?=[.[])/g, '')
      const actual = await new Function(...names, `return (${call})`)(...names.map((name) => exports[name]))
      if (!matches(actual, example.expected, example.approximate)) {
        expect.fail(`${example.file}:${example.line}: ${example.call} gives ${JSON.stringify(actual)}, the comment says ${JSON.stringify(example.expected)}`)
      }
    })
  }
})
