import { describe, expect, it } from 'vitest'
import { signedArea } from './polygon-measure'
import { chordCount, repeatOutline } from './ring'
import { ARC_CHORD_TOLERANCE_INCHES } from './tolerances'
import type { Point } from './types'

describe('repeatOutline', () => {
  it('spans 0 to 360°/N counter-clockwise, a wedge starting at the centre', () => {
    const { polygon } = repeatOutline({ innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' })
    expect(polygon[0]).toEqual([0, 0])
    expect(polygon[1]).toEqual([9, 0])
    const last = polygon[polygon.length - 1] as Point
    // 360°/4 = 90°: the arc ends on +y (arithmetic)
    expect(last[0]).toBeCloseTo(0, 12)
    expect(last[1]).toBeCloseTo(9, 12)
    expect(signedArea(polygon)).toBeGreaterThan(0)
  })

  it('keeps every chord within 0.005 in of the true arc', () => {
    for (const [radius, repeats] of [[9, 4], [20, 2], [0.5, 36], [12, 7]] as const) {
      const ring = { innerRadius: radius / 3, outerRadius: radius, repeats, repeatMode: 'rotate' as const }
      const { polygon, parts } = repeatOutline(ring)
      polygon.forEach((a, i) => {
        if (parts[i] !== 'outer-arc' && parts[i] !== 'inner-arc') return
        const b = polygon[(i + 1) % polygon.length] as Point
        const r = Math.hypot(a[0], a[1])
        // the chord's middle is the farthest point from the arc: r − |midpoint| (sagitta, from memory: s = r(1 − cos θ/2))
        const sagitta = r - Math.hypot((a[0] + b[0]) / 2, (a[1] + b[1]) / 2)
        expect(sagitta).toBeLessThanOrEqual(ARC_CHORD_TOLERANCE_INCHES + 1e-12)
      })
    }
  })

  it('uses no more chords than the tolerance needs', () => {
    // θ ≤ 2·acos(1 − 0.005/9) = 0.06668 rad; 90° = 1.5708 rad needs ⌈23.56⌉ = 24 chords (arithmetic)
    expect(chordCount(9, Math.PI / 2)).toBe(24)
  })

  it('closes an annular sector through the inner arc', () => {
    const { polygon, parts } = repeatOutline({ innerRadius: 2, outerRadius: 9, repeats: 6, repeatMode: 'mirror' })
    expect(polygon[0]).toEqual([2, 0])
    expect(parts.filter((part) => part === 'start-radial' || part === 'end-radial')).toHaveLength(2)
    // sector area = (r_o² − r_i²)·θ/2 = (81 − 4)·(π/3)/2 = 40.317 sq in, chords cut a little off (arithmetic)
    expect(signedArea(polygon)).toBeCloseTo((77 * Math.PI) / 6, 0)
    expect(signedArea(polygon)).toBeLessThan((77 * Math.PI) / 6)
  })
})
