/**
 * The demo's flagship pattern, Hollyberry Wreath: an invented 18 in wreath of four rotated
 * quarters, drawn the way a designer would draw it for folded leaves.
 *
 * Each quarter has two foundations. The centre (four areas) makes a pinwheel star where the
 * quarters meet. The outer foundation is a band of seven background pieces cut by four "vine"
 * seams at uneven angles, plus a small ear at each radial edge. A stem ring lies over the band,
 * and each vine seam catches one stacked leaf exactly where it crosses the stem, the leaves
 * turning alternately out of and into the ring. Every leaf lies over the piece on its vine's
 * clockwise side, so that piece must be sewn first: the leaves, not the shapes, make the band
 * sew from the x-axis edge round to the y-axis edge (without them the plan sews it the other way).
 * Berries in threes and embroidered tendrils sit in the background, clear of the seams and leaves.
 */
import type { DesignFile } from '../lib/schemas/design'

type Xy = [number, number]

/** Rounds to 1/10000 in, so the file holds short, stable numbers. */
const round = (value: number): number => Math.round(value * 10_000) / 10_000
/** A point at `radius` inches and `degrees` from +x. */
const polar = (radius: number, degrees: number): Xy => [
  round(radius * Math.cos((degrees * Math.PI) / 180)),
  round(radius * Math.sin((degrees * Math.PI) / 180)),
]
/** The point a fraction `t` of the way from `a` to `b`. */
const between = (a: Xy, b: Xy, t: number): Xy => [round(a[0] + (b[0] - a[0]) * t), round(a[1] + (b[1] - a[1]) * t)]

/** The stem ring's radius: the leaves' open ends sit on it, hidden under the stem. */
const STEM_RADIUS = 6.25

/** The fraction of the way from `a` (inside the circle) to `b` where a segment leaves the circle of `radius`. */
function leavesCircleAt(a: Xy, b: Xy, radius: number): number {
  const d: Xy = [b[0] - a[0], b[1] - a[1]]
  const qa = d[0] ** 2 + d[1] ** 2
  const qb = 2 * (a[0] * d[0] + a[1] * d[1])
  const qc = a[0] ** 2 + a[1] ** 2 - radius ** 2
  return round((-qb + Math.sqrt(qb * qb - 4 * qa * qc)) / (2 * qa))
}

/**
 * An embroidered tendril leaving the stem's edge at `degrees`: a short run away from the stem,
 * then a spiral closing in over 1.1 turns. `turn` 1 curls counter-clockwise round the ring, −1
 * clockwise; `out` 1 grows outside the ring, −1 inside; `size` scales it (1 ≈ 1.3 in tall).
 */
function tendril(degrees: number, turn: 1 | -1, out: 1 | -1, size: number): Xy[] {
  const angle = (degrees * Math.PI) / 180
  const start = polar(STEM_RADIUS + out * 0.15, degrees)
  const along: Xy = [-Math.sin(angle) * turn, Math.cos(angle) * turn]
  const away: Xy = [Math.cos(angle) * out, Math.sin(angle) * out]
  const local: Xy[] = [[0, 0], [0.08, 0.45]]
  for (let k = 0; k <= 8; k += 1) {
    const theta = Math.PI - (k / 8) * 2.2 * Math.PI
    const r = 0.4 - (k / 8) * 0.28
    local.push([0.6 + r * Math.cos(theta), 0.9 + r * Math.sin(theta)])
  }
  return local.map(([u, v]): Xy => [
    round(start[0] + size * (u * along[0] + v * away[0])),
    round(start[1] + size * (u * along[1] + v * away[1])),
  ])
}

/** Three 1/2 in berries just outside the stem, around `degrees`. */
const berryCluster = (degrees: number): NonNullable<DesignFile['berries']> => [
  { at: polar(6.9, degrees), finishedDiameter: 0.5, fabric: 'berry' },
  { at: polar(7.32, degrees + 2.2), finishedDiameter: 0.5, fabric: 'berry' },
  { at: polar(7.35, degrees - 2.4), finishedDiameter: 0.5, fabric: 'berry' },
]

// The centre's outer edge, from the x-axis to the y-axis (a little off square, so the star turns).
const heartFrom: Xy = [5, 0]
const heartTo: Xy = [0, 4.3]
const onHeart = (t: number): Xy => between(heartFrom, heartTo, t)
const heartSplit: [Xy, Xy] = [[2.2, 0], onHeart(0.56)]
/** The vine seams, from the centre's edge to the outer arc, each leaning its own way. */
const vines: [Xy, Xy][] = [
  [onHeart(0.15), polar(9, 23)],
  [onHeart(0.4), polar(9, 41)],
  [onHeart(0.64), polar(9, 62)],
  [onHeart(0.88), polar(9, 79)],
]

/** A stacked leaf on vine `n`, its open end where the vine crosses the stem; `angle` > 0 turns it out of the ring. */
const leafOnVine = (n: number, angle: number): NonNullable<DesignFile['leaves']>[number] => ({
  id: `leaf-${n}`,
  seam: `vine-${n}`,
  at: leavesCircleAt(...vines[n - 1]!, STEM_RADIUS),
  side: 'right',
  angle,
  length: 1.75,
  width: 0.75,
  layers: n % 2 === 1 ? ['leaf-dark', 'leaf-light'] : ['leaf-light', 'leaf-dark'],
})

export const hollyberryWreath: DesignFile = {
  format: 'wreathwright-design',
  version: 2,
  name: 'Hollyberry Wreath',
  units: 'in',
  ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
  seams: [
    { id: 'heart', from: heartFrom, to: heartTo },
    { id: 'heart-split', from: heartSplit[0], to: heartSplit[1] },
    { id: 'heart-split-2', from: [0, 2.3], to: between(...heartSplit, 0.6) },
    { id: 'star-point', from: [3.4, 0], to: onHeart(0.3) },
    ...vines.map(([from, to], index) => ({ id: `vine-${index + 1}`, from, to })),
    { id: 'ear-east', from: [7.2, 0], to: polar(9, 9) },
    { id: 'ear-north', from: [0, 6.9], to: polar(9, 83.5) },
  ],
  fills: [
    { at: [1, 0.9], fabric: 'star-dark' },
    { at: [0.9, 2.7], fabric: 'star-light' },
    { at: [2.7, 0.5], fabric: 'star-light' },
    { at: [3.9, 0.4], fabric: 'star-dark' },
    { at: polar(7.5, 8), fabric: 'background' },
    { at: polar(7.5, 28), fabric: 'background-shade' },
    { at: polar(7.5, 48), fabric: 'background' },
    { at: polar(7.5, 68), fabric: 'background-shade' },
    { at: polar(6, 86), fabric: 'background' },
    { at: [8.4, 0.4], fabric: 'background-shade' },
    { at: [0.4, 8.5], fabric: 'background-shade' },
  ],
  leaves: [leafOnVine(1, -35), leafOnVine(2, 35), leafOnVine(3, -35), leafOnVine(4, 35)],
  stems: [{ radius: STEM_RADIUS, finishedWidth: 0.375, fabric: 'stem' }],
  berries: [...berryCluster(10), ...berryCluster(54.5)],
  curls: [{ points: tendril(30, -1, -1, 0.9) }, { points: tendril(66, 1, -1, 0.9) }, { points: tendril(42, 1, 1, 0.8) }],
  // Fabric names are invented for the demo: descriptions a shop might use, not real products.
  colorways: [
    {
      name: 'Snowberry Dusk',
      fabrics: {
        background: { name: 'Snowberry white tone-on-tone', color: '#eef2f5' },
        'background-shade': { name: 'Frosted pane crossweave', color: '#e1e8ee' },
        'star-dark': { name: 'Slate blue ditsy print', color: '#6f88a3' },
        'star-light': { name: 'Winter sky solid', color: '#b4c4d4' },
        'leaf-dark': { name: 'Holly green batik', color: '#2f5540' },
        'leaf-light': { name: 'Sage sprig print', color: '#7da37a' },
        stem: { name: 'Bark brown shot cotton', color: '#4a3a2a' },
        berry: { name: 'Rosehip red tonal dot', color: '#a3392b' },
        binding: { name: 'Midnight spruce solid', color: '#24384a' },
      },
    },
    {
      name: 'Cider Orchard',
      fabrics: {
        background: { name: 'Oat cream linen-look', color: '#f6eddc' },
        'background-shade': { name: 'Wheat sheaf tone-on-tone', color: '#eee0c4' },
        'star-dark': { name: 'Russet apple check', color: '#8c3b1f' },
        'star-light': { name: 'Amber honey batik', color: '#d08a3c' },
        'leaf-dark': { name: 'Cinnamon bark crossweave', color: '#7a3d12' },
        'leaf-light': { name: 'Mustard seed dot', color: '#c8962e' },
        stem: { name: 'Walnut shell solid', color: '#4b3020' },
        berry: { name: 'Mulled plum tonal', color: '#6e1f2e' },
        binding: { name: 'Burnt cider plaid', color: '#5a2a14' },
      },
    },
  ],
  order: null,
}
