'use client'

import { Fragment, useMemo } from 'react'
import { Circle, Line, Shape, Text } from 'react-konva'
import { sectionOutlines, type BoardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore, View } from '@/lib/board/store'
import { toScreen } from '@/lib/board/view'
import { areaShapes, type Point } from './board-geometry'
import { drawRingScene, ringScene } from './ring-scene'
import { useBoard } from './use-board'

/** Section outlines take turns in these colours so neighbouring papers are told apart. */
const SECTION_COLOURS = ['#2f5540', '#1d4e89', '#87291d', '#7a5a00', '#5b2a86']

/** Flattens points to Konva's [x0, y0, x1, y1, …] in screen pixels. */
export function screenPoints(points: readonly Point[], view: View, repeats: number): number[] {
  return points.flatMap((p) => toScreen(p, view, repeats))
}

/**
 * The whole ring, drawn in one canvas pass, with area labels on repeat 0 and the problems marked
 * where they are. `plan` may lag one frame behind `design` while a seam is dragged.
 */
export function RingShapes({ store, design, plan, view }: { store: BoardStore; design: BoardDesign; plan: BoardPlan; view: View }) {
  const colorwayName = useBoard(store, (state) => state.activeColorway)
  const colours = useMemo(() => {
    const fabrics = design.colorways.find((c) => c.name === colorwayName)?.fabrics ?? design.colorways[0]?.fabrics ?? {}
    return Object.fromEntries(Object.entries(fabrics).map(([fabric, { color }]) => [fabric, color]))
  }, [design.colorways, colorwayName])
  const scene = useMemo(() => ringScene(design, plan, colours), [design, plan, colours])
  const labels = useMemo(() => areaShapes(plan).filter((area) => area.label), [plan])
  const sections = sectionOutlines(plan)
  const repeats = design.ring.repeats
  const labelSize = Math.max(9, Math.min(16, view.zoom * (design.units === 'cm' ? 0.35 : 0.9)))

  return (
    <>
      <Shape sceneFunc={(context) => drawRingScene(context._context, scene, view, repeats)} listening={false} perfectDrawEnabled={false} />
      {sections.length > 1 &&
        sections.flatMap((section, index) =>
          section.rings.map((ring, r) => (
            <Line
              key={`section-${section.label}-${r}`}
              points={screenPoints(ring, view, repeats)}
              closed
              stroke={SECTION_COLOURS[index % SECTION_COLOURS.length]}
              strokeWidth={3.5}
              opacity={0.8}
              dash={[12, 5]}
              listening={false}
            />
          )),
        )}
      {labels.map((area) => {
        const [x, y] = toScreen(area.labelAt, view, repeats)
        return (
          <Text
            key={`label-${area.id}`}
            x={x - 30}
            y={y - labelSize / 2}
            width={60}
            align="center"
            text={area.label!}
            fontSize={labelSize}
            fontStyle="bold"
            fill="#1c1917"
            shadowColor="#ffffff"
            shadowBlur={3}
            shadowOpacity={1}
            listening={false}
          />
        )
      })}
      {plan.problems.map((problem, index) => {
        const [x, y] = toScreen(problem.at, view, repeats)
        const error = problem.severity === 'error'
        return (
          <Fragment key={`problem-${index}`}>
            <Circle x={x} y={y} radius={9} fill={error ? '#a3392b' : '#d79b1f'} stroke="#ffffff" strokeWidth={2} listening={false} />
            <Text x={x - 9} y={y - 6} width={18} align="center" text={error ? '!' : '?'} fontSize={12} fontStyle="bold" fill="#ffffff" listening={false} />
          </Fragment>
        )
      })}
    </>
  )
}
