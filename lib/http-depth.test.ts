/** lib/http.ts `nestsDeeperThan`: the depth check run on every JSON body before JSON.parse. */
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { MAX_JSON_DEPTH, nestsDeeperThan } from './http'

const bytes = (text: string) => new TextEncoder().encode(text)

/** The depth of a parsed value, counted with a stack (the reference the byte scan must agree with). */
function depthOfValue(value: unknown): number {
  let deepest = 0
  const stack: [unknown, number][] = [[value, 0]]
  while (stack.length > 0) {
    const [item, depth] = stack.pop()!
    if (item === null || typeof item !== 'object') continue
    deepest = Math.max(deepest, depth + 1)
    for (const child of Object.values(item)) stack.push([child, depth + 1])
  }
  return deepest
}

describe('nestsDeeperThan', () => {
  it('counts arrays and objects, not brackets inside strings (escaped quotes included)', () => {
    expect(nestsDeeperThan(bytes('[[["[[[\\"[[["]]]'), 3)).toBe(false)
    expect(nestsDeeperThan(bytes('{"a":[{"b":[]}]}'), 3)).toBe(true)
    expect(nestsDeeperThan(bytes('{"a":[{"b":[]}]}'), 4)).toBe(false)
  })

  it('agrees with the depth of the parsed value for any JSON text', () => {
    fc.assert(
      fc.property(fc.json({ maxDepth: 8 }), fc.integer({ min: 0, max: 10 }), (text, limit) => {
        expect(nestsDeeperThan(bytes(text), limit)).toBe(depthOfValue(JSON.parse(text)) > limit)
      }),
      { numRuns: 500 },
    )
  })

  it(`finds a 2 MB body of brackets deeper than ${MAX_JSON_DEPTH} in one pass`, () => {
    expect(nestsDeeperThan(bytes('['.repeat(1_000_000) + ']'.repeat(1_000_000)), MAX_JSON_DEPTH)).toBe(true)
    expect(nestsDeeperThan(bytes('['.repeat(MAX_JSON_DEPTH) + ']'.repeat(MAX_JSON_DEPTH)), MAX_JSON_DEPTH)).toBe(false)
  })
})
