/**
 * What the pointer does on the board, tool by tool, in the design's units. The canvas turns
 * screen pixels into design units and calls these; the tests call them directly.
 */
import { unitsPerInch } from '@/lib/units'
import { areaAt, boardPlan } from './board-plan'
import { hitTest, projectOntoSeam } from './hit-test'
import type { Point } from '@/geometry'
import { snapSeamEnd } from './snapping'
import { design, EMPTY_DRAFT, type BoardStore } from './store'

export interface PointerModifiers {
  /** Alt turns snapping off while it is held. */
  readonly alt?: boolean
}

/** Starting sizes of new leaves and berries, in inches (converted for centimetre designs). */
export const NEW_LEAF_INCHES = { length: 1.5, width: 0.75 }
export const NEW_BERRY_DIAMETER_INCHES = 0.5

type Drag =
  | { kind: 'seam-end'; seamId: string; end: 'from' | 'to' }
  | { kind: 'leaf'; leafId: string }
  | { kind: 'berry'; index: number; offset: Point }
  | { kind: 'new-seam'; from: Point; pressed: boolean }
  | null

export interface PointerController {
  down(point: Point, modifiers?: PointerModifiers): void
  move(point: Point, modifiers?: PointerModifiers): void
  up(point: Point, modifiers?: PointerModifiers): void
  /** Finishes a curl. */
  doubleClick(): void
  /** Escape: drops what is being drawn or dragged, putting things back. */
  cancel(): void
  /** Enter: finishes a curl or a two-click seam. */
  commit(): void
}


/**
 * Creates the pointer behaviour for a store. `tolerance()` is how near (in design units) the
 * pointer must come to something to catch it: a few screen pixels at the current zoom.
 */
export function createPointerController(store: BoardStore, tolerance: () => number): PointerController {
  let drag: Drag = null

  const snapping = (modifiers?: PointerModifiers) => {
    const settings = store.getState().snapping
    return modifiers?.alt ? { ...settings, enabled: false } : settings
  }
  const snap = (point: Point, modifiers?: PointerModifiers, anchor?: Point, ignoreSeam?: string) =>
    snapSeamEnd(point, { design: design(store.getState()), snapping: snapping(modifiers), tolerance: tolerance(), anchor, ignoreSeam })
  const setDraft = (change: Parameters<BoardStore['setDraft']>[0]) => store.setDraft(change)
  const fabricOr = (fallback: string) => store.getState().activeFabric ?? fallback

  function finishCurl() {
    const points = store.getState().draft.curl
    if (points && points.length >= 2) store.run('addCurl', { points: points.map((p) => [p[0], p[1]] as [number, number]) })
    setDraft({ curl: null })
  }

  return {
    down(point, modifiers) {
      const state = store.getState()
      const current = design(state)
      const scale = unitsPerInch(current.units)
      switch (state.tool) {
        case 'select': {
          const hit = hitTest(current, point, tolerance())
          if (!hit) return store.select(null)
          if (hit.kind === 'seam-end') {
            store.select({ kind: 'seam', id: hit.seamId })
            drag = { kind: 'seam-end', seamId: hit.seamId, end: hit.end }
            store.beginDrag()
          } else if (hit.kind === 'leaf') {
            store.select({ kind: 'leaf', id: hit.leafId })
            drag = { kind: 'leaf', leafId: hit.leafId }
            store.beginDrag()
          } else if (hit.kind === 'berry') {
            const at = current.berries[hit.index]!.at
            store.select({ kind: 'berry', index: hit.index })
            drag = { kind: 'berry', index: hit.index, offset: [at[0] - point[0], at[1] - point[1]] }
            store.beginDrag()
          } else if (hit.kind === 'seam') {
            store.select({ kind: 'seam', id: hit.seamId })
          } else if (hit.kind === 'curl') {
            store.select({ kind: 'curl', index: hit.index })
          }
          return
        }
        case 'seam': {
          const snapped = snap(point, modifiers, drag?.kind === 'new-seam' ? drag.from : undefined)
          if (drag?.kind === 'new-seam') {
            // Second click of a two-click seam.
            store.run('addSeam', { from: [drag.from[0], drag.from[1]], to: [snapped.point[0], snapped.point[1]] })
            drag = null
            return setDraft(EMPTY_DRAFT)
          }
          drag = { kind: 'new-seam', from: snapped.point, pressed: true }
          return setDraft({ seam: [snapped.point, snapped.point], snap: snapped })
        }
        case 'fill': {
          const plan = boardPlan(current)
          const area = areaAt(plan, point)
          if (!area) return
          const replacing = current.fills.filter((fill) => areaAt(plan, fill.at)?.id === area.id).map((fill) => fill.at)
          return store.run('fillArea', { at: [point[0], point[1]], fabric: fabricOr('background'), replacing: replacing.map((p) => [p[0], p[1]] as [number, number]) })
        }
        case 'leaf': {
          let best: { seamId: string; fraction: number; side: 'left' | 'right'; distance: number } | null = null
          for (const seam of current.seams) {
            const projection = projectOntoSeam(point, seam.from, seam.to)
            if (projection.distance <= tolerance() * 3 && (!best || projection.distance < best.distance)) best = { seamId: seam.id, ...projection }
          }
          if (!best) return
          store.run('addLeaf', {
            seam: best.seamId,
            at: Math.min(0.95, Math.max(0.05, Math.round(best.fraction * 100) / 100)),
            side: best.side,
            angle: 0,
            length: NEW_LEAF_INCHES.length * scale,
            width: NEW_LEAF_INCHES.width * scale,
            layers: [fabricOr('leaf')],
          })
          const leaves = design(store.getState()).leaves
          return store.select({ kind: 'leaf', id: leaves[leaves.length - 1]!.id })
        }
        case 'berry': {
          store.run('addBerry', { at: [point[0], point[1]], finishedDiameter: NEW_BERRY_DIAMETER_INCHES * scale, fabric: fabricOr('berry') })
          return store.select({ kind: 'berry', index: design(store.getState()).berries.length - 1 })
        }
        case 'curl':
          return setDraft({ curl: [...(state.draft.curl ?? []), point] })
        case 'order': {
          const plan = boardPlan(current)
          const area = areaAt(plan, point)
          if (!area) return
          const already = (state.handOrderDraft ?? []).some((section) => section.some((p) => areaAt(plan, p)?.id === area.id))
          if (already) return
          return store.addHandOrderArea([area.labelAt[0], area.labelAt[1]])
        }
      }
    },

    move(point, modifiers) {
      const current = design(store.getState())
      if (!drag) {
        if (store.getState().tool === 'seam') setDraft({ snap: snap(point, modifiers) })
        return
      }
      if (drag.kind === 'seam-end') {
        const { seamId, end } = drag
        const seam = current.seams.find((s) => s.id === seamId)
        if (!seam) return
        const anchor = end === 'from' ? seam.to : seam.from
        const snapped = snap(point, modifiers, anchor, seam.id)
        store.run('moveSeamEnd', { seamId, end, to: [snapped.point[0], snapped.point[1]] })
        return setDraft({ snap: snapped })
      }
      if (drag.kind === 'leaf') {
        const { leafId } = drag
        const leaf = current.leaves.find((l) => l.id === leafId)
        const seam = leaf && current.seams.find((s) => s.id === leaf.seam)
        if (!leaf || !seam) return
        const fraction = Math.min(0.95, Math.max(0.05, projectOntoSeam(point, seam.from, seam.to).fraction))
        return store.run('updateLeaf', { leafId: leaf.id, changes: { at: Math.round(fraction * 1000) / 1000 } })
      }
      if (drag.kind === 'berry') {
        return store.run('updateBerry', { index: drag.index, changes: { at: [point[0] + drag.offset[0], point[1] + drag.offset[1]] } })
      }
      if (drag.kind === 'new-seam') {
        const snapped = snap(point, modifiers, drag.from)
        setDraft({ seam: [drag.from, snapped.point], snap: snapped })
      }
    },

    up(point, modifiers) {
      if (!drag) return
      if (drag.kind === 'new-seam') {
        if (!drag.pressed) return
        const end = snap(point, modifiers, drag.from).point
        const length = Math.hypot(end[0] - drag.from[0], end[1] - drag.from[1])
        if (length > tolerance() * 2) {
          // Press-drag-release draws the seam at once.
          store.run('addSeam', { from: [drag.from[0], drag.from[1]], to: [end[0], end[1]] })
          drag = null
          setDraft(EMPTY_DRAFT)
        } else {
          // A click: the next click ends the seam.
          drag = { ...drag, pressed: false }
        }
        return
      }
      store.endDrag()
      drag = null
      setDraft({ snap: null })
    },

    doubleClick() {
      if (store.getState().tool === 'curl') finishCurl()
    },

    cancel() {
      if (drag && drag.kind !== 'new-seam') store.cancelDrag()
      drag = null
      store.cancelDraft()
    },

    commit() {
      if (store.getState().tool === 'curl') finishCurl()
    },
  }
}
