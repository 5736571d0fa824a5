import { describe, expect, it } from 'vitest'
import { sortPatterns } from './sort-patterns'

const row = (overrides: Partial<{ name: string; state: 'draft' | 'testing' | 'published' | 'retired'; updatedAt: string }>) => ({
  name: 'Holly ring',
  state: 'draft' as const,
  updatedAt: '2026-11-01T10:00:00.000Z',
  ...overrides,
})

describe('sortPatterns', () => {
  it('sorts names alphabetically without regard to case, numbers by value', () => {
    const rows = [row({ name: 'ring 10' }), row({ name: 'Ring 9' }), row({ name: 'acorn' })]
    expect(sortPatterns(rows, 'name', 'ascending').map((r) => r.name)).toEqual(['acorn', 'Ring 9', 'ring 10'])
  })

  it('sorts states in the order a pattern lives them, not alphabetically', () => {
    const rows = [row({ state: 'retired' }), row({ state: 'draft' }), row({ state: 'published' }), row({ state: 'testing' })]
    expect(sortPatterns(rows, 'state', 'ascending').map((r) => r.state)).toEqual(['draft', 'testing', 'published', 'retired'])
  })

  it('puts the most recently changed first when descending by last change', () => {
    const rows = [row({ name: 'old', updatedAt: '2026-01-01T00:00:00Z' }), row({ name: 'new', updatedAt: '2026-06-01T00:00:00Z' })]
    expect(sortPatterns(rows, 'updatedAt', 'descending').map((r) => r.name)).toEqual(['new', 'old'])
  })

  it('does not reorder its input', () => {
    const rows = [row({ name: 'b' }), row({ name: 'a' })]
    sortPatterns(rows, 'name', 'ascending')
    expect(rows.map((r) => r.name)).toEqual(['b', 'a'])
  })
})
