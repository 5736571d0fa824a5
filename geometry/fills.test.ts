import { describe, expect, it } from 'vitest'
import { fabricsOfAreas } from './fills'

const square = (x: number) => [[x, 0], [x + 1, 0], [x + 1, 1], [x, 1]] as const
const areas = [{ id: 'left', polygon: square(0) }, { id: 'right', polygon: square(1) }]

describe('fabricsOfAreas', () => {
  it('gives each area the fabric of the fill inside it', () => {
    const fabrics = fabricsOfAreas([{ at: [0.5, 0.5], fabric: 'sky' }, { at: [1.5, 0.5], fabric: 'leaf' }], areas)
    expect([...fabrics]).toEqual([['left', 'sky'], ['right', 'leaf']])
  })

  it('lets the last fill win when two fall in one area', () => {
    const fabrics = fabricsOfAreas([{ at: [0.2, 0.5], fabric: 'sky' }, { at: [0.8, 0.5], fabric: 'leaf' }], areas)
    expect(fabrics.get('left')).toBe('leaf')
    expect(fabrics.has('right')).toBe(false)
  })
})
