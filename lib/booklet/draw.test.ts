import { describe, expect, it } from 'vitest'
import { arcToBeziers, fitView, toPage, trueScaleView } from './draw'

describe('arcs as Bézier pieces', () => {
  it('uses k = 4/3·tan(θ/4) for a quarter circle (common practice for cubic arcs)', () => {
    const [piece] = arcToBeziers({ kind: 'arc', center: [0, 0], radius: 1, startAngle: 0, endAngle: Math.PI / 2, anticlockwise: true })
    // 4/3 · tan(π/8) = 0.55228…
    expect(piece![0][1]).toBeCloseTo(0.55228, 5)
    expect(piece![2][0]).toBeCloseTo(0, 12)
    expect(piece![2][1]).toBeCloseTo(1, 12)
  })

  it('splits an arc wider than 90° and stays within 0.0003 radius of the circle', () => {
    const arc = { kind: 'arc' as const, center: [1, 2] as const, radius: 12, startAngle: 0.1, endAngle: 0.1 - 2.5, anticlockwise: false }
    const pieces = arcToBeziers(arc)
    expect(pieces).toHaveLength(2)
    let start: readonly [number, number] = [1 + 12 * Math.cos(0.1), 2 + 12 * Math.sin(0.1)]
    for (const [c1, c2, end] of pieces) {
      for (let t = 0; t <= 1; t += 0.05) {
        const u = 1 - t
        const x = u ** 3 * start[0] + 3 * u * u * t * c1[0] + 3 * u * t * t * c2[0] + t ** 3 * end[0]
        const y = u ** 3 * start[1] + 3 * u * u * t * c1[1] + 3 * u * t * t * c2[1] + t ** 3 * end[1]
        expect(Math.abs(Math.hypot(x - 1, y - 2) - 12)).toBeLessThan(12 * 3e-4)
      }
      start = end
    }
  })
})

describe('views', () => {
  it('puts one design inch on 72 points, y turned down the page', () => {
    expect(toPage(trueScaleView(0, 0, 10, 20), [1, -2])).toEqual([82, 164])
  })

  it('fits a box keeping its proportions', () => {
    const view = fitView([0, 0, 10, 5], { x: 0, y: 0, width: 100, height: 100 })
    expect(view.scale).toBe(10)
    expect(toPage(view, [0, 5])).toEqual([0, 25])
  })
})
