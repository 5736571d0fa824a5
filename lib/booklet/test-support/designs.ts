/**
 * Designs for the booklet's tests, built with the same schema a design file goes through.
 * Invented shapes, never check values.
 */
import type { Design } from '@/geometry'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'

const polar = (radius: number, degrees: number): [number, number] => [
  radius * Math.cos((degrees * Math.PI) / 180), radius * Math.sin((degrees * Math.PI) / 180),
]

/** Parses a design file or fails the test with the first issue. */
export function designFrom(file: DesignFile): Design {
  const parsed = parseDesign(file)
  if (!parsed.ok) throw new Error(`test design is invalid: ${parsed.issues[0]?.path} ${parsed.issues[0]?.message}`)
  return parsed.design
}

/** An 18 in wreath of quarters with a band, two stacked leaves, a stem ring, berries and a curl. */
export function wreathFile(overrides: Partial<DesignFile> = {}): DesignFile {
  return {
    format: 'wreathwright-design',
    version: 2,
    name: 'Test Wreath',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
    seams: [
      { id: 'centre', from: [4, 0], to: [0, 4] },
      { id: 'band', from: [7, 0], to: [0, 7] },
      { id: 'vein', from: [3.5, 3.5], to: polar(9, 45) },
    ],
    fills: [
      { at: [1, 1], fabric: 'background' },
      { at: [2.5, 3], fabric: 'band' },
      { at: [6, 1.5], fabric: 'background' },
      { at: [1.5, 6], fabric: 'sky' },
    ],
    leaves: [
      { id: 'l1', seam: 'band', at: 0.3, side: 'left', angle: 0, length: 1.75, width: 0.875, layers: ['leaf-dark', 'leaf-light'] },
      { id: 'l2', seam: 'band', at: 0.7, side: 'left', angle: 0, length: 1.75, width: 0.875, layers: ['leaf-dark', 'leaf-light'] },
    ],
    stems: [{ radius: 7.75, finishedWidth: 0.375, fabric: 'stem' }],
    berries: [{ at: polar(7.75, 20), finishedDiameter: 0.625, fabric: 'berry' }],
    curls: [{ points: [polar(8.1, 40), polar(8.4, 44), polar(8.2, 49)] }],
    colorways: [
      {
        name: 'Holly',
        fabrics: {
          background: { name: 'Parchment tone-on-tone', color: '#f4ecd8' }, band: { name: 'Pale fern crossweave', color: '#c9d6b8' },
          sky: { name: 'Morning mist solid', color: '#b8c9d6' }, 'leaf-dark': { name: 'Holly green batik', color: '#2f5540' },
          'leaf-light': { name: 'Sage sprig print', color: '#6f9a6a' }, stem: { name: 'Bark brown shot cotton', color: '#4a3a2a' },
          berry: { name: 'Rosehip red tonal dot', color: '#a3392b' },
        },
      },
      {
        name: 'Frost',
        fabrics: {
          background: { name: 'Snowberry white tone-on-tone', color: '#eef2f5' }, band: { name: 'Icicle blue crossweave', color: '#c8d4de' },
          sky: { name: 'Frozen pond solid', color: '#dde6ee' }, 'leaf-dark': { name: 'Spruce shadow batik', color: '#41607a' },
          'leaf-light': { name: 'Glacier print', color: '#8fb0c8' }, stem: { name: 'Pewter shot cotton', color: '#5b6670' },
          berry: { name: 'Silver birch dot', color: '#d9dee3' },
        },
      },
    ],
    order: null,
    ...overrides,
  }
}

/**
 * One section of three areas that read differently in a mirror: a small triangle at the
 * centre, then two areas cut off by seams of different slopes.
 */
export function asymmetricFile(): DesignFile {
  return wreathFile({
    name: 'Lopsided',
    seams: [
      { id: 's1', from: [2, 0], to: [0, 3] },
      { id: 's2', from: [7, 0], to: [0, 4] },
    ],
    fills: [
      { at: [0.5, 0.5], fabric: 'background' },
      { at: [3, 1], fabric: 'band' },
      { at: [5, 5], fabric: 'sky' },
    ],
    leaves: [],
    stems: [],
    berries: [],
    curls: [],
  })
}

/** Sixths with a centre opening, alternately mirrored; a seam ends on a chord seam (a T-junction). */
export function medallionFile(): DesignFile {
  const cos30 = Math.cos(Math.PI / 6)
  return wreathFile({
    name: 'Test Medallion',
    ring: { innerRadius: 3, outerRadius: 10, repeats: 6, repeatMode: 'mirror' },
    seams: [
      { id: 'inner-band', from: [6, 0], to: polar(6, 60) },
      { id: 'outer-band', from: [8.5, 0], to: polar(8.5, 60) },
      { id: 'divide', from: polar(8.5 * cos30, 30), to: polar(10, 30) },
    ],
    fills: [
      { at: polar(4.5, 30), fabric: 'background' },
      { at: polar(7, 30), fabric: 'band' },
      { at: polar(9.2, 12), fabric: 'sky' },
      { at: polar(9.2, 48), fabric: 'sky' },
    ],
    leaves: [],
    stems: [],
    berries: [],
    curls: [],
  })
}
