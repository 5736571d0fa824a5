import { describe, expect, it } from 'vitest'
import { formatInches, formatLength, formatSize } from './format'

describe('formatting lengths', () => {
  it('writes inches in eighths', () => {
    expect(formatInches(3.25)).toBe('3 1/4 in')
    expect(formatInches(0.875)).toBe('7/8 in')
    expect(formatInches(2)).toBe('2 in')
  })

  it('writes centimetres to the millimetre (1 in = 2.54 cm exactly)', () => {
    expect(formatLength(1, 'cm')).toBe('2.5 cm')
    expect(formatLength(10, 'cm')).toBe('25.4 cm')
  })

  it('writes a piece size once with its unit', () => {
    expect(formatSize(3.25, 2.5, 'in')).toBe('3 1/4 × 2 1/2 in')
  })
})
