import { describe, expect, it } from 'vitest'
import {
  centimetresToInches, centimetresToPoints, formatInches, inchesToCentimetres, inchesToPoints, millimetresToPoints, pointsToInches,
} from './units'

describe('units', () => {
  it('makes one inch 72 points (ISO 32000-1:2008 §8.3.2.3, default user space)', () => {
    expect(inchesToPoints(1)).toBe(72)
    expect(pointsToInches(72)).toBe(1)
  })

  it('makes 2 cm 56.6929 pt (1 in = 25.4 mm exactly, 1959 agreement)', () => {
    // 20 mm / 25.4 mm per in × 72 pt per in = 56.692913… pt
    expect(centimetresToPoints(2)).toBeCloseTo(56.6929, 4)
  })

  it('gives A4 and A3 in points as ISO 216:2007 sizes do', () => {
    expect(millimetresToPoints(210)).toBeCloseTo(595.28, 2)
    expect(millimetresToPoints(297)).toBeCloseTo(841.89, 2)
    expect(millimetresToPoints(420)).toBeCloseTo(1190.55, 2)
  })

  it('round-trips inches and centimetres', () => {
    expect(inchesToCentimetres(1)).toBe(2.54)
    expect(centimetresToInches(inchesToCentimetres(3.7))).toBeCloseTo(3.7, 12)
  })

  it('writes lengths as a ruler reads them, to 1/8 in', () => {
    expect(formatInches(2.375)).toBe('2 3/8 in')
    expect(formatInches(0.25)).toBe('1/4 in')
    expect(formatInches(3)).toBe('3 in')
    expect(formatInches(0)).toBe('0 in')
  })
})
