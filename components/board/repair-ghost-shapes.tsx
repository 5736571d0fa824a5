'use client'

import { Fragment, useMemo } from 'react'
import { Line } from 'react-konva'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore, View } from '@/lib/board/store'
import { leafShapes, ringTransforms, transformPoints } from './board-geometry'
import { OTHER_REPEATS_OPACITY } from './ring-scene'
import { screenPoints } from './ring-shapes'
import { useBoard } from './use-board'

/** A colour no other overlay uses (selection green, sewing-line red, section outlines), so a ghost reads as "proposed". */
const GHOST = '#8a2be2'

/**
 * The suggested repair being pointed at, drawn over the ring in every repeat as the board draws
 * seams (repeat 0 bold, the others paler): each new or moved seam dashed, where it lies now faint;
 * a resized leaf dashed at its new size (every layer, as the board draws leaves). Nodes are named
 * `repair-ghost`, `repair-ghost-before` and `repair-ghost-leaf` (the end-to-end test finds them).
 */
export function RepairGhostShapes({ store, design, view }: { store: BoardStore; design: BoardDesign; view: View }) {
  const shown = useBoard(store, (state) => state.shownRepair)
  const transforms = useMemo(() => ringTransforms(design), [design])
  // The resized leaves as the board would draw them, on the seams the repair leaves.
  const leaves = useMemo(() => (shown && shown.resizedLeaves.length > 0 ? leafShapes({ ...design, seams: [...shown.seams], leaves: [...shown.resizedLeaves] }) : []), [shown, design])
  // A ghost belongs to the design it was suggested for; after any change it is gone.
  if (!shown || shown.base !== design) return null
  const repeats = design.ring.repeats
  const pixels = (points: readonly (readonly [number, number])[]) => screenPoints(points, view, repeats)

  return (
    <>
      {transforms.map((transform, k) => {
        const opacity = k === 0 ? 1 : OTHER_REPEATS_OPACITY
        return (
          <Fragment key={k}>
            {shown.changes.map((change) => (
              <Fragment key={change.id}>
                {change.before && (
                  <Line name="repair-ghost-before" points={pixels(transformPoints(transform, change.before))} stroke={GHOST} strokeWidth={k === 0 ? 6 : 4} opacity={0.2 * opacity} lineCap="round" listening={false} />
                )}
                {change.after && (
                  <Line name="repair-ghost" points={pixels(transformPoints(transform, change.after))} stroke={GHOST} strokeWidth={k === 0 ? 3 : 2} dash={[9, 5]} opacity={opacity} listening={false} />
                )}
              </Fragment>
            ))}
            {leaves.flatMap((leaf) =>
              leaf.layers.map((layer, index) => (
                <Line key={`leaf ${leaf.id} ${index}`} name="repair-ghost-leaf" points={pixels(transformPoints(transform, layer.outline))} closed stroke={GHOST} strokeWidth={k === 0 ? 2 : 1.5} dash={[6, 4]} opacity={opacity} listening={false} />
              )),
            )}
          </Fragment>
        )
      })}
    </>
  )
}
