/**
 * Bad bodies for fuzzing (issue 17, item 3): arbitrary JSON and non-JSON, and a known good body
 * with one field made wrong — another type, a huge string, deep nesting. Every arbitrary here
 * yields the body as text, so that shapes JSON.stringify cannot write (nesting 100,000 deep) still
 * reach the parser as a client could send them.
 */
import fc from 'fast-check'

export type FieldPath = readonly (string | number)[]

/**
 * Every path inside a value, containers included, in the order met: `{ a: [1] }` gives
 * `[['a'], ['a', 0]]`. At most `limit` paths, so a large design still gives a short list.
 */
export function pathsOf(value: unknown, limit = 400): FieldPath[] {
  const paths: FieldPath[] = []
  const stack: [unknown, FieldPath][] = [[value, []]]
  while (stack.length > 0 && paths.length < limit) {
    const [item, at] = stack.shift()!
    if (at.length > 0) paths.push(at)
    if (Array.isArray(item)) item.forEach((child, index) => stack.push([child, [...at, index]]))
    else if (item !== null && typeof item === 'object') for (const [key, child] of Object.entries(item)) stack.push([child, [...at, key]])
  }
  return paths
}

/** A copy of `value` with `replacement` at `path` (the value there replaced, or a key added). */
export function withValueAt(value: unknown, path: FieldPath, replacement: unknown): unknown {
  if (path.length === 0) return replacement
  const copy = structuredClone(value) as Record<string | number, unknown>
  let parent = copy
  for (const key of path.slice(0, -1)) parent = parent[key] as Record<string | number, unknown>
  parent[path.at(-1)!] = replacement
  return copy
}

/** Stands for a value written into the text afterwards (deep nesting JSON.stringify cannot write). */
const MARKER = '\u2063fuzz-marker\u2063'

/** The body's text with `rawValue` (JSON text) at `path`. */
function textWithRawAt(sample: unknown, path: FieldPath, rawValue: string): string {
  return JSON.stringify(withValueAt(sample, path, MARKER)).replace(JSON.stringify(MARKER), () => rawValue)
}

/** A JSON text of arrays `depth` deep: `[[[]]]` for 3. */
export const nestedArrays = (depth: number): string => '['.repeat(depth) + ']'.repeat(depth)
/** A JSON text of objects `depth` deep: `{"a":{"a":{}}}` for 3. */
export const nestedObjects = (depth: number): string => '{"a":'.repeat(depth - 1) + '{}' + '}'.repeat(depth - 1)

export interface BadBodyOptions {
  /** The route's largest body in bytes: huge strings and deep nesting go past it, or stay within. */
  readonly limit: number
}

/** Any JSON value fast-check makes, as text: `undefined` (nothing to write) becomes an empty body. */
const anyValueText = fc.anything({ maxDepth: 3, maxKeys: 6 }).map((value) => JSON.stringify(value) ?? '')

/** A string of `length` characters that take 3 bytes each in UTF-8. */
const wideString = (length: number) => '\u8449'.repeat(length)

/**
 * Bad bodies for a route whose good body looks like `sample`: arbitrary values, JSON texts and
 * text that is not JSON at all, or the sample with one field given another value (any type), a
 * huge string or deep nesting. Some of them may still be good; the caller keeps only those the
 * route's schema refuses.
 */
export function badBodies(sample: unknown, { limit }: BadBodyOptions): fc.Arbitrary<string> {
  const paths = pathsOf(sample)
  const at = paths.length > 0 ? fc.constantFrom(...paths) : fc.constant<FieldPath>([])
  const lengths = fc.oneof(fc.integer({ min: 1, max: 300 }), fc.integer({ min: Math.floor(limit / 4), max: Math.ceil(limit / 2) }))
  // Shallow; about lib/http.ts MAX_JSON_DEPTH (10,000); far deeper, as far as the limit allows (each level 2 bytes or more).
  const depths = fc.oneof(
    fc.integer({ min: 2, max: 60 }),
    fc.integer({ min: 9_000, max: 11_000 }),
    fc.integer({ min: 20_000, max: Math.max(20_000, Math.min(200_000, Math.floor(limit / 2))) }),
  )
  return fc.oneof(
    anyValueText,
    fc.json({ maxDepth: 4 }),
    fc.string({ maxLength: 200 }),
    fc.tuple(at, fc.anything({ maxDepth: 2, maxKeys: 4 })).map(([path, value]) => JSON.stringify(withValueAt(sample, path, value ?? null))),
    fc.tuple(at, lengths).map(([path, length]) => JSON.stringify(withValueAt(sample, path, wideString(length)))),
    fc.tuple(at, depths, fc.boolean()).map(([path, depth, arrays]) => textWithRawAt(sample, path, arrays ? nestedArrays(depth) : nestedObjects(depth))),
  )
}
