/**
 * Reads a PDF back with pdfjs-dist (legacy build, Node) for the booklet's tests: page sizes, text
 * with positions, and the drawn paths with the clip in force when each was painted. Test-only.
 */
import { createRequire } from 'node:module'
import { dirname, join } from 'node:path'
import * as pdfjs from 'pdfjs-dist/legacy/build/pdf.mjs'

const require = createRequire(import.meta.url)
/** pdfjs needs its standard font data to measure Helvetica text in Node. */
const standardFontDataUrl = `${join(dirname(require.resolve('pdfjs-dist/package.json')), 'standard_fonts')}/`

export type PdfDocument = Awaited<ReturnType<typeof pdfjs.getDocument>['promise']>

/** Opens PDF bytes. */
export async function openPdf(bytes: Uint8Array): Promise<PdfDocument> {
  return pdfjs.getDocument({ data: bytes.slice(), standardFontDataUrl, verbosity: 0 }).promise
}

/** Width and height of every page, points, from each page's view box. */
export async function pageSizes(doc: PdfDocument): Promise<[number, number][]> {
  const sizes: [number, number][] = []
  for (let n = 1; n <= doc.numPages; n += 1) {
    const view = (await doc.getPage(n)).view
    sizes.push([view[2]! - view[0]!, view[3]! - view[1]!])
  }
  return sizes
}

export interface TextItem {
  readonly text: string
  /** Baseline start, PDF user space (y up). */
  readonly x: number
  readonly y: number
  readonly width: number
  readonly height: number
}

/** The text items of one page (1-based). */
export async function pageText(doc: PdfDocument, pageNumber: number): Promise<TextItem[]> {
  const content = await (await doc.getPage(pageNumber)).getTextContent()
  const items: TextItem[] = []
  for (const item of content.items) {
    if (!('str' in item) || item.str.trim() === '') continue
    items.push({ text: item.str, x: item.transform[4] as number, y: item.transform[5] as number, width: item.width, height: item.height })
  }
  return items
}

/** All text of the document, one string. */
export async function allText(doc: PdfDocument): Promise<string> {
  const parts: string[] = []
  for (let n = 1; n <= doc.numPages; n += 1) parts.push((await pageText(doc, n)).map((item) => item.text).join(' '))
  return parts.join('\n')
}

export interface Rect {
  readonly minX: number
  readonly minY: number
  readonly maxX: number
  readonly maxY: number
}

export interface DrawnPath {
  /** Sub-paths as point lists (curve control points included), PDF user space. */
  readonly subpaths: [number, number][][]
  /** True when the sub-path commands were four lines and a close: a rectangle as `re` becomes. */
  readonly painted: boolean
  /** The intersection of the clip rectangles in force (null when none). */
  readonly clip: Rect | null
  readonly bounds: Rect
}

type Matrix = [number, number, number, number, number, number]
const multiply = (m: Matrix, n: Matrix): Matrix => [
  m[0] * n[0] + m[1] * n[2], m[0] * n[1] + m[1] * n[3],
  m[2] * n[0] + m[3] * n[2], m[2] * n[1] + m[3] * n[3],
  m[4] * n[0] + m[5] * n[2] + n[4], m[4] * n[1] + m[5] * n[3] + n[5],
]

/**
 * Every path constructed on a page, with its clip. pdfjs 5 folds `re`, `m`, `l`, `c` and `h`
 * into one constructPath operator whose data is [0 x y] moveTo, [1 x y] lineTo,
 * [2 x1 y1 x2 y2 x3 y3] curveTo, [4] closePath.
 */
export async function pagePaths(doc: PdfDocument, pageNumber: number): Promise<DrawnPath[]> {
  const page = await doc.getPage(pageNumber)
  const list = await page.getOperatorList()
  const OPS = pdfjs.OPS
  const stack: { ctm: Matrix; clip: Rect | null }[] = []
  let state: { ctm: Matrix; clip: Rect | null } = { ctm: [1, 0, 0, 1, 0, 0], clip: null }
  let pendingClip = false
  const paths: DrawnPath[] = []
  list.fnArray.forEach((fn, index) => {
    const args = list.argsArray[index] as unknown[]
    if (fn === OPS.save) stack.push({ ...state })
    else if (fn === OPS.restore) state = stack.pop() ?? state
    else if (fn === OPS.transform) state = { ...state, ctm: multiply(args as Matrix, state.ctm) }
    else if (fn === OPS.clip || fn === OPS.eoClip) pendingClip = true
    else if (fn === OPS.constructPath) {
      const paintOp = args[0] as number
      const data = Array.from((args[1] as ArrayLike<number>[])[0] ?? [])
      const subpaths: [number, number][][] = []
      let current: [number, number][] = []
      const at = (x: number, y: number): [number, number] => {
        const m = state.ctm
        return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]]
      }
      for (let i = 0; i < data.length; ) {
        const code = data[i]!
        if (code === 0) {
          if (current.length) subpaths.push(current)
          current = [at(data[i + 1]!, data[i + 2]!)]
          i += 3
        } else if (code === 1) {
          current.push(at(data[i + 1]!, data[i + 2]!))
          i += 3
        } else if (code === 2) {
          current.push(at(data[i + 1]!, data[i + 2]!), at(data[i + 3]!, data[i + 4]!), at(data[i + 5]!, data[i + 6]!))
          i += 7
        } else if (code === 3) {
          current.push(at(data[i + 1]!, data[i + 2]!), at(data[i + 3]!, data[i + 4]!))
          i += 5
        } else {
          i += 1
        }
      }
      if (current.length) subpaths.push(current)
      const points = subpaths.flat()
      const bounds: Rect = {
        minX: Math.min(...points.map((p) => p[0])), minY: Math.min(...points.map((p) => p[1])),
        maxX: Math.max(...points.map((p) => p[0])), maxY: Math.max(...points.map((p) => p[1])),
      }
      if (pendingClip) {
        pendingClip = false
        state = { ...state, clip: state.clip ? intersect(state.clip, bounds) : bounds }
        if (paintOp === OPS.endPath) return
      }
      paths.push({ subpaths, painted: paintOp !== OPS.endPath, clip: state.clip, bounds })
    }
  })
  return paths
}

function intersect(a: Rect, b: Rect): Rect {
  return { minX: Math.max(a.minX, b.minX), minY: Math.max(a.minY, b.minY), maxX: Math.min(a.maxX, b.maxX), maxY: Math.min(a.maxY, b.maxY) }
}

/**
 * Axis-aligned rectangles among the drawn paths (four corners and a close, as `re` is read):
 * their width and height, points, and where they are.
 */
export async function pageRectangles(doc: PdfDocument, pageNumber: number): Promise<{ x: number; y: number; width: number; height: number }[]> {
  const rectangles: { x: number; y: number; width: number; height: number }[] = []
  for (const path of await pagePaths(doc, pageNumber)) {
    if (!path.painted) continue
    for (const subpath of path.subpaths) {
      if (subpath.length !== 4) continue
      const xs = subpath.map((p) => p[0])
      const ys = subpath.map((p) => p[1])
      const axisAligned = subpath.every((p, i) => {
        const q = subpath[(i + 1) % 4]!
        return Math.abs(p[0] - q[0]) < 1e-3 || Math.abs(p[1] - q[1]) < 1e-3
      })
      if (!axisAligned) continue
      rectangles.push({ x: Math.min(...xs), y: Math.min(...ys), width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys) })
    }
  }
  return rectangles
}

/** An image painted on a page: where its unit square lands (PDF user space) and the clip in force. */
export interface DrawnImage {
  readonly x: number
  readonly y: number
  readonly width: number
  readonly height: number
  readonly clip: Rect | null
}

/** Every image painted on a page (1-based), with the clip rectangles in force when it was. */
export async function pageImages(doc: PdfDocument, pageNumber: number): Promise<DrawnImage[]> {
  const page = await doc.getPage(pageNumber)
  const list = await page.getOperatorList()
  const OPS = pdfjs.OPS
  const stack: { ctm: Matrix; clip: Rect | null }[] = []
  let state: { ctm: Matrix; clip: Rect | null } = { ctm: [1, 0, 0, 1, 0, 0], clip: null }
  let pendingClip = false
  const images: DrawnImage[] = []
  list.fnArray.forEach((fn, index) => {
    const args = list.argsArray[index] as unknown[]
    if (fn === OPS.save) stack.push({ ...state })
    else if (fn === OPS.restore) state = stack.pop() ?? state
    else if (fn === OPS.transform) state = { ...state, ctm: multiply(args as Matrix, state.ctm) }
    else if (fn === OPS.clip || fn === OPS.eoClip) pendingClip = true
    else if (fn === OPS.constructPath && pendingClip) {
      pendingClip = false
      const data = Array.from((args[1] as ArrayLike<number>[])[0] ?? [])
      const xs: number[] = []
      const ys: number[] = []
      for (let i = 0; i < data.length; ) {
        const code = data[i]!
        const pairs = code === 0 || code === 1 ? 1 : code === 2 ? 3 : code === 3 ? 2 : 0
        for (let k = 0; k < pairs; k += 1) {
          const [x, y] = [data[i + 1 + 2 * k]!, data[i + 2 + 2 * k]!]
          const m = state.ctm
          xs.push(m[0] * x + m[2] * y + m[4])
          ys.push(m[1] * x + m[3] * y + m[5])
        }
        i += 1 + 2 * pairs
      }
      const bounds: Rect = { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) }
      state = { ...state, clip: state.clip ? intersect(state.clip, bounds) : bounds }
    } else if (fn === OPS.paintImageXObject || fn === OPS.paintInlineImageXObject || fn === OPS.paintImageMaskXObject) {
      const m = state.ctm
      const corners: [number, number][] = [[0, 0], [1, 0], [0, 1], [1, 1]].map(([u, v]) => [m[0] * u! + m[2] * v! + m[4], m[1] * u! + m[3] * v! + m[5]])
      const xs = corners.map((p) => p[0])
      const ys = corners.map((p) => p[1])
      images.push({ x: Math.min(...xs), y: Math.min(...ys), width: Math.max(...xs) - Math.min(...xs), height: Math.max(...ys) - Math.min(...ys), clip: state.clip })
    }
  })
  return images
}
