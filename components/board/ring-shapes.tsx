'use client'

import { Fragment, useMemo } from 'react'
import { Circle, Line, Text } from 'react-konva'
import type { BoardPlan } from '@/lib/board/board-plan'
import type { BoardDesign } from '@/lib/board/commands'
import type { BoardStore, View } from '@/lib/board/store'
import { toScreen } from '@/lib/board/view'
import { areaShapes, leafShapes, repeatOutlinePolygon, ringTransforms, transformPoints, type Point } from './board-geometry'
import { useBoard } from './use-board'

const UNFILLED = '#ffffff'
const SEAM = '#3b3127'
const OTHER_REPEATS_OPACITY = 0.55

/** Flattens points to Konva's [x0, y0, x1, y1, …] in screen pixels. */
export function screenPoints(points: readonly Point[], view: View, repeats: number): number[] {
  return points.flatMap((p) => toScreen(p, view, repeats))
}

/** The whole ring: every repeat's areas in their fabrics, seams, appliqué and leaves; labels on repeat 0. */
export function RingShapes({ store, design, plan, view }: { store: BoardStore; design: BoardDesign; plan: BoardPlan; view: View }) {
  const colorwayName = useBoard(store, (state) => state.activeColorway)
  const colours = design.colorways.find((c) => c.name === colorwayName)?.fabrics ?? design.colorways[0]?.fabrics ?? {}
  const colourOf = (fabric: string | null) => (fabric ? colours[fabric] ?? '#bbbbbb' : UNFILLED)
  const areas = useMemo(() => areaShapes(design, plan), [design, plan])
  const leaves = useMemo(() => leafShapes(design), [design])
  const transforms = useMemo(() => ringTransforms(design), [design])
  const outline = useMemo(() => repeatOutlinePolygon(design), [design])
  const repeats = design.ring.repeats
  const pixels = (points: readonly Point[]) => screenPoints(points, view, repeats)
  const labelSize = Math.max(9, Math.min(16, view.zoom * (design.units === 'cm' ? 0.35 : 0.9)))

  return (
    <>
      {transforms.map((transform, k) => (
        <Fragment key={k}>
          <Line
            points={pixels(transformPoints(transform, outline))}
            closed
            fill={UNFILLED}
            stroke={SEAM}
            strokeWidth={k === 0 ? 2 : 1}
            opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY}
          />
          {areas.map((area) => (
            <Line
              key={area.id}
              points={pixels(transformPoints(transform, area.polygon))}
              closed
              fill={colourOf(area.fabric)}
              stroke={SEAM}
              strokeWidth={k === 0 ? 1.5 : 0.75}
              opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY}
            />
          ))}
          {/* Seams drawn even when the plan has no areas (an unclosed design). */}
          {design.seams.map((seam) => (
            <Line
              key={seam.id}
              points={pixels(transformPoints(transform, [seam.from, seam.to]))}
              stroke={SEAM}
              strokeWidth={k === 0 ? 2 : 1}
              opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY}
            />
          ))}
        </Fragment>
      ))}
      {design.stems.map((stem, index) => {
        const [cx, cy] = toScreen([0, 0], view, repeats)
        return (
          <Circle key={index} x={cx} y={cy} radius={stem.radius * view.zoom} stroke={colourOf(stem.fabric)} strokeWidth={Math.max(2, stem.finishedWidth * view.zoom)} opacity={0.9} />
        )
      })}
      {transforms.map((transform, k) => (
        <Fragment key={`appliqué-${k}`}>
          {leaves.map((leaf) =>
            leaf.layers.map((layer, index) => (
              <Line
                key={`${leaf.id}-${index}`}
                points={pixels(transformPoints(transform, layer.outline))}
                closed
                fill={colourOf(layer.fabric)}
                stroke="#1f2a1f"
                strokeWidth={0.75}
                opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY}
              />
            )),
          )}
          {design.curls.map((curl, index) => (
            <Line
              key={`curl-${index}`}
              points={pixels(transformPoints(transform, curl.points))}
              stroke="#4a3a2a"
              strokeWidth={1.5}
              tension={0.5}
              dash={[4, 3]}
              opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY}
            />
          ))}
          {design.berries.map((berry, index) => {
            const [x, y] = toScreen(transformPoints(transform, [berry.at])[0]!, view, repeats)
            return (
              <Circle key={`berry-${index}`} x={x} y={y} radius={(berry.finishedDiameter / 2) * view.zoom} fill={colourOf(berry.fabric)} stroke="#2b1d14" strokeWidth={0.75} opacity={k === 0 ? 1 : OTHER_REPEATS_OPACITY} />
            )
          })}
        </Fragment>
      ))}
      {areas.map((area) => {
        if (!area.label) return null
        const [x, y] = toScreen(area.labelAt, view, repeats)
        return (
          <Text
            key={`label-${area.id}`}
            x={x - 30}
            y={y - labelSize / 2}
            width={60}
            align="center"
            text={area.label}
            fontSize={labelSize}
            fontStyle="bold"
            fill="#1c1917"
            shadowColor="#ffffff"
            shadowBlur={3}
            shadowOpacity={1}
          />
        )
      })}
      {plan.plan?.problems.map((problem, index) => {
        const [x, y] = toScreen([problem.at[0] * plan.unitsPerInch, problem.at[1] * plan.unitsPerInch], view, repeats)
        const error = problem.severity === 'error'
        return (
          <Fragment key={`problem-${index}`}>
            <Circle x={x} y={y} radius={9} fill={error ? '#a3392b' : '#d79b1f'} stroke="#ffffff" strokeWidth={2} />
            <Text x={x - 9} y={y - 6} width={18} align="center" text={error ? '!' : '?'} fontSize={12} fontStyle="bold" fill="#ffffff" />
          </Fragment>
        )
      })}
    </>
  )
}
