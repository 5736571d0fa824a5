'use client'

import { useMemo } from 'react'
import { Circle, Label, Line, Rect, Tag, Text } from 'react-konva'
import { sectionLetter, smoothCurve } from '@/geometry'
import type { BoardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import { formatSize } from '@/lib/units'
import type { BoardStore, View } from '@/lib/board/store'
import { toScreen } from '@/lib/board/view'
import { leafShapes, type Point } from './board-geometry'
import { RepairGhostShapes } from './repair-ghost-shapes'
import { screenPoints } from './ring-shapes'
import { useBoard } from './use-board'

const HIGHLIGHT = '#2f5540'

/** A curl's smooth curve as Konva's bezier points: the start, then three points per piece. */
function curvePoints(points: readonly Point[]): Point[] {
  const curve = smoothCurve(points)
  return [curve.start, ...curve.pieces.flat()]
}
const TOOLTIP_WIDTH = 280

/** What is selected, being drawn, or highlighted by the step-through, over the ring. */
export function OverlayShapes({ store, design, plan, view, width }: { store: BoardStore; design: BoardDesign; plan: BoardPlan; view: View; width: number }) {
  const selection = useBoard(store, (state) => state.selection)
  const tool = useBoard(store, (state) => state.tool)
  const draft = useBoard(store, (state) => state.draft)
  const step = useBoard(store, (state) => state.step)
  const handOrder = useBoard(store, (state) => state.handOrderDraft)
  const shownProblem = useBoard(store, (state) => state.shownProblem)
  const repeats = design.ring.repeats
  const pixels = (points: readonly Point[]) => screenPoints(points, view, repeats)
  const steps = plan.steps
  const leaves = useMemo(() => leafShapes(design), [design])
  const current = step !== null ? steps[Math.min(step, steps.length - 1)] : undefined

  return (
    <>
      {current && (
        <>
          <Line points={pixels(current.polygon)} closed fill="rgba(47,85,64,0.35)" stroke={HIGHLIGHT} strokeWidth={3} />
          {current.sewnAlong && (
            <Line points={pixels(current.sewnAlong)} stroke="#a3392b" strokeWidth={4} dash={[10, 5]} />
          )}
          {(() => {
            // Before the flip the piece lies right side down over the sewn areas, mirrored across the sewing line.
            const placed = current.roughCutPlaced
            const [x, y] = toScreen(placed[0]!, view, repeats)
            return (
              <>
                <Line points={pixels(placed)} closed stroke="#6b4f2a" strokeWidth={2} dash={[6, 4]} fill="rgba(215,155,31,0.15)" />
                <Text x={x + 4} y={y + 4} text={`cut ${formatSize(current.planned.roughCut.widthIn, current.planned.roughCut.heightIn, design.units)}`} fontSize={12} fill="#6b4f2a" />
              </>
            )
          })()}
          {leaves
            .filter((leaf) => current.planned.leavesBefore.includes(leaf.id))
            .map((leaf) => (
              <Line key={leaf.id} points={pixels(leaf.layers[0]!.outline)} closed stroke="#d79b1f" strokeWidth={3} />
            ))}
        </>
      )}
      {selection?.kind === 'seam' &&
        design.seams
          .filter((seam) => seam.id === selection.id)
          .map((seam) => <Line key={seam.id} points={pixels([seam.from, seam.to])} stroke={HIGHLIGHT} strokeWidth={5} opacity={0.6} />)}
      {selection?.kind === 'leaf' &&
        leaves
          .filter((leaf) => leaf.id === selection.id)
          .map((leaf) => <Line key={leaf.id} points={pixels(leaf.layers[0]!.outline)} closed stroke={HIGHLIGHT} strokeWidth={3} />)}
      {selection?.kind === 'berry' && design.berries[selection.index] && (() => {
        const berry = design.berries[selection.index]!
        const [x, y] = toScreen(berry.at, view, repeats)
        return <Circle x={x} y={y} radius={(berry.finishedDiameter / 2) * view.zoom + 4} stroke={HIGHLIGHT} strokeWidth={2} />
      })()}
      {selection?.kind === 'curl' && design.curls[selection.index] && (
        // The curl's own curve: Konva's bezier line reads start, then control, control, end per piece.
        <Line points={pixels(curvePoints(design.curls[selection.index]!.points))} bezier stroke={HIGHLIGHT} strokeWidth={4} opacity={0.6} />
      )}
      {tool === 'select' &&
        design.seams.flatMap((seam) =>
          (['from', 'to'] as const).map((end) => {
            const [x, y] = toScreen(seam[end], view, repeats)
            return <Rect key={`${seam.id}-${end}`} x={x - 4} y={y - 4} width={8} height={8} fill="#ffffff" stroke={HIGHLIGHT} strokeWidth={1.5} />
          }),
        )}
      <RepairGhostShapes store={store} design={design} view={view} />
      {draft.seam && <Line points={pixels(draft.seam)} stroke={HIGHLIGHT} strokeWidth={2} dash={[8, 4]} />}
      {draft.snap && draft.snap.kind !== 'none' && (() => {
        const [x, y] = toScreen(draft.snap.point, view, repeats)
        return <Circle x={x} y={y} radius={5} stroke="#a3392b" strokeWidth={2} />
      })()}
      {draft.curl && <Line points={pixels(draft.curl)} stroke="#4a3a2a" strokeWidth={2} tension={0.5} dash={[4, 3]} />}
      {shownProblem !== null && plan.problems[shownProblem] && (() => {
        const problem = plan.problems[shownProblem]!
        const [x, y] = toScreen(problem.at, view, repeats)
        const error = problem.severity === 'error'
        return (
          // The message box opens to the left when it would run off the board's right edge.
          <Label x={x + 12 + TOOLTIP_WIDTH > width ? x - 12 - TOOLTIP_WIDTH : x + 12} y={y + 12}>
            <Tag fill="#ffffff" stroke={error ? '#a3392b' : '#d79b1f'} strokeWidth={1.5} cornerRadius={4} shadowColor="#000000" shadowOpacity={0.15} shadowBlur={6} />
            <Text text={problem.message} width={TOOLTIP_WIDTH} padding={8} fontSize={12} lineHeight={1.3} fill="#1c1917" />
          </Label>
        )
      })()}
      {handOrder?.flatMap((section, s) =>
        section.map((point, index) => {
          const [x, y] = toScreen(point, view, repeats)
          return (
            <Text key={`${s}-${index}`} x={x - 20} y={y + 10} width={40} align="center" text={`${sectionLetter(s)}${index + 1}?`} fontSize={13} fill="#a3392b" fontStyle="bold" />
          )
        }),
      )}
    </>
  )
}
