import { describe, expect, it } from 'vitest'
import {
  centimetresToInches, centimetresToPoints, formatInches, formatSize, inchesToCentimetres, inchesToPoints, millimetresToPoints,
  pointsToInches, unitsPerInch,
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

  it('writes negative lengths with their fraction, and nothing as 0 (one formatter for the whole app)', () => {
    // Ruler reading to 1/8 in (common practice); the old board formatter printed -0.25 as "-1 in".
    expect(formatInches(-0.25)).toBe('-1/4 in')
    expect(formatInches(-2.375)).toBe('-2 3/8 in')
    expect(formatInches(-0.01)).toBe('0 in')
    expect(formatInches(0.06)).toBe('0 in') // under 1/16 in rounds to nothing
    expect(formatInches(0.07)).toBe('1/8 in')
    expect(formatInches(3.25)).toBe('3 1/4 in')
    expect(formatInches(0.875)).toBe('7/8 in')
  })

  it('writes centimetres to the millimetre (1 in = 2.54 cm exactly, 1959 agreement)', () => {
    expect(formatSize(1, 10, 'cm')).toBe('2.5 × 25.4 cm') // 2.54 cm and 10 × 2.54 cm
    expect(formatSize(-0.25, 0, 'cm')).toBe('-0.6 × 0.0 cm') // -0.635 cm to the millimetre
    expect(formatSize(-0.01, 0.01, 'cm')).toBe('0.0 × 0.0 cm') // never "-0.0"
    expect(formatSize(-0.25, 0, 'in')).toBe('-1/4 × 0 in')
  })

  it('writes a piece size once with its unit', () => {
    expect(formatSize(3.25, 2.5, 'in')).toBe('3 1/4 × 2 1/2 in')
  })

  it('counts a design unit per inch: 1 for inches, 2.54 for centimetres (1959 agreement)', () => {
    expect(unitsPerInch('in')).toBe(1)
    expect(unitsPerInch('cm')).toBe(2.54)
  })
})
