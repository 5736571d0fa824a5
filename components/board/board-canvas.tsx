'use client'

import type Konva from 'konva'
import { useDeferredValue, useEffect, useMemo, useRef, type MutableRefObject } from 'react'
import { Layer, Stage } from 'react-konva'
import { boardPlan } from '@/lib/board/board-plan'
import type { PointerController } from '@/lib/board/pointer'
import { design as designOf, type BoardStore } from '@/lib/board/store'
import { toScreen, toWorld } from '@/lib/board/view'
import { OverlayShapes } from './overlay-shapes'
import { RingShapes } from './ring-shapes'
import { useBoard } from './use-board'

/** How near, in pixels, the pointer must come to a problem marker to show its message. */
const PROBLEM_MARKER_PIXELS = 12

/**
 * The drafting board's canvas. It draws from the store and forwards pointer events, in design
 * units, to the pointer controller; it holds no design state of its own.
 */
export function BoardCanvas({
  store,
  pointer,
  width,
  height,
  stageRef,
}: {
  store: BoardStore
  pointer: PointerController
  width: number
  height: number
  stageRef?: MutableRefObject<Konva.Stage | null>
}) {
  const design = useBoard(store, designOf)
  const view = useBoard(store, (state) => state.view)
  // Planning a large repeat takes longer than a frame: the seams follow the pointer at once and
  // the areas, labels and problems catch up as soon as the plan of the latest design is ready.
  const plannedDesign = useDeferredValue(design)
  const plan = useMemo(() => boardPlan(plannedDesign), [plannedDesign])
  const panning = useRef<{ from: [number, number] } | null>(null)
  const localStage = useRef<Konva.Stage | null>(null)

  const worldOf = (stage: Konva.Stage | null) => {
    const position = stage?.getPointerPosition()
    if (!position) return null
    return toWorld([position.x, position.y], store.getState().view, design.ring.repeats)
  }

  /** Shows the message of a problem marker when the pointer comes within a few pixels of it. */
  const showProblemNear = (screen: readonly [number, number]) => {
    const state = store.getState()
    const problems = plan.problems
    let found: number | null = null
    problems.forEach((problem, index) => {
      const [x, y] = toScreen(problem.at, state.view, design.ring.repeats)
      if (Math.hypot(x - screen[0], y - screen[1]) <= PROBLEM_MARKER_PIXELS) found = index
    })
    if (found !== state.shownProblem) store.showProblem(found)
  }

  // Redraw at most once per animation frame however many store changes a pointer move causes.
  useEffect(() => {
    const stage = localStage.current
    if (stage) stage.batchDraw()
  })

  return (
    <Stage
      ref={(stage) => {
        localStage.current = stage
        if (stageRef) stageRef.current = stage
      }}
      width={width}
      height={height}
      onPointerDown={(event) => {
        const stage = event.target.getStage()
        const native = event.evt
        if (native.button === 1 || native.button === 2) {
          panning.current = { from: [native.clientX, native.clientY] }
          return
        }
        // Keep receiving this pointer's moves and its release even when it leaves the canvas,
        // so a drag let go over a panel still ends (and can be saved).
        stage?.content.setPointerCapture?.(native.pointerId)
        const world = worldOf(stage)
        if (world) pointer.down(world, { alt: native.altKey })
      }}
      onPointerMove={(event) => {
        const native = event.evt
        if (panning.current) {
          const [x, y] = panning.current.from
          store.panBy(native.clientX - x, native.clientY - y)
          panning.current = { from: [native.clientX, native.clientY] }
          return
        }
        const stage = event.target.getStage()
        const world = worldOf(stage)
        if (world) pointer.move(world, { alt: native.altKey })
        const position = stage?.getPointerPosition()
        if (position) showProblemNear([position.x, position.y])
      }}
      onPointerUp={(event) => {
        if (panning.current) {
          panning.current = null
          return
        }
        const world = worldOf(event.target.getStage())
        if (world) pointer.up(world, { alt: event.evt.altKey })
      }}
      onPointerCancel={() => {
        panning.current = null
        pointer.cancel()
      }}
      onDblClick={() => pointer.doubleClick()}
      onContextMenu={(event) => event.evt.preventDefault()}
      onWheel={(event) => {
        event.evt.preventDefault()
        const position = event.target.getStage()?.getPointerPosition()
        if (!position) return
        const factor = Math.exp(-event.evt.deltaY * 0.0015)
        store.zoomAt([position.x, position.y], factor)
      }}
    >
      <Layer listening={false}>
        <RingShapes store={store} design={design} plan={plan} view={view} />
      </Layer>
      <Layer listening={false}>
        <OverlayShapes store={store} design={design} plan={plan} view={view} width={width} />
      </Layer>
    </Stage>
  )
}
