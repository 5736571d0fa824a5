import { describe, expect, it } from 'vitest'
import { colourDistance, distinctColours, nearestPixel, NEAR_IDENTICAL, toHex, toOklab } from './palette'

describe('toHex', () => {
  it('writes #rrggbb with two lower-case digits per channel, rounded and clamped', () => {
    expect(toHex([0, 0, 0])).toBe('#000000')
    expect(toHex([255, 255, 255])).toBe('#ffffff')
    expect(toHex([10.4, 300, -3])).toBe('#0aff00')
  })
})

describe('toOklab', () => {
  it('puts white at L = 1 and black at L = 0 with no hue (OKLab definition, Ottosson 2020)', () => {
    const [l, a, b] = toOklab([255, 255, 255])
    expect(l).toBeCloseTo(1, 3)
    expect(a).toBeCloseTo(0, 3)
    expect(b).toBeCloseTo(0, 3)
    expect(toOklab([0, 0, 0])).toEqual([0, 0, 0])
  })

  it('gives sRGB red L ≈ 0.628, a ≈ 0.225, b ≈ 0.126 (the published OKLab value of #ff0000)', () => {
    const [l, a, b] = toOklab([255, 0, 0])
    expect(l).toBeCloseTo(0.628, 3)
    expect(a).toBeCloseTo(0.225, 3)
    expect(b).toBeCloseTo(0.126, 3)
  })
})

describe('distinctColours', () => {
  it('drops a colour one step away from one already kept, keeps clearly different ones, in order', () => {
    const colours = [
      [200, 30, 40],
      [201, 31, 40],
      [30, 120, 60],
      [240, 230, 200],
    ] as const
    expect(colourDistance(colours[0], colours[1])).toBeLessThan(NEAR_IDENTICAL)
    expect(distinctColours(colours, 8)).toEqual([colours[0], colours[2], colours[3]])
  })

  it('stops at the maximum', () => {
    const greys = Array.from({ length: 20 }, (_, i) => [i * 13, i * 13, i * 13] as const)
    expect(distinctColours(greys, 8)).toHaveLength(8)
  })
})

describe('nearestPixel', () => {
  it('finds the pixel nearest to an averaged colour, in RGB and RGBA data', () => {
    const rgb = new Uint8Array([255, 0, 0, 0, 0, 255, 128, 128, 0])
    expect(nearestPixel(rgb, 3, [100, 110, 10])).toEqual([128, 128, 0])
    const rgba = new Uint8Array([255, 0, 0, 255, 0, 0, 250, 255])
    expect(nearestPixel(rgba, 4, [10, 10, 200])).toEqual([0, 0, 250])
  })
})
