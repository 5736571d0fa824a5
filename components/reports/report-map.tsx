'use client'

import { useMemo, useRef, type MouseEvent } from 'react'
import { applyTransform, repeatTransforms } from '@/geometry'
import { areaLabelAt } from '@/lib/report-place'
import type { ReportMap as ReportMapData } from '@/lib/schemas/report'

/**
 * The pattern's ring as the plan divides it, every repeat drawn and the first repeat's areas
 * labelled: a tester clicks the point a report is about. Drawn in inches (y up) in an SVG, so the
 * point clicked is a point of the design, whatever the size on screen.
 */
export function ReportMap({ map, point, onPick }: { map: ReportMapData; point: readonly [number, number] | null; onPick: (point: [number, number] | null) => void }) {
  const svg = useRef<SVGSVGElement>(null)
  const radius = map.ring.outerRadius * 1.04
  const shapes = useMemo(
    () =>
      repeatTransforms(map.ring).flatMap((transform, repeat) =>
        map.areas.map((area, index) => ({
          key: `${repeat}-${index}`,
          first: repeat === 0,
          points: area.polygon.map((corner) => applyTransform(transform, corner).join(',')).join(' '),
        })),
      ),
    [map],
  )
  const pickedArea = point ? areaLabelAt(map, map.ring, point) : null

  function pick(event: MouseEvent<SVGSVGElement>) {
    const element = svg.current
    const matrix = element?.getScreenCTM()
    if (!element || !matrix) return
    const at = new DOMPoint(event.clientX, event.clientY).matrixTransform(matrix.inverse())
    // The drawing is flipped (y up): the point in inches is (x, −y), to 1/100 in.
    const inches: [number, number] = [Math.round(at.x * 100) / 100, Math.round(-at.y * 100) / 100]
    onPick(Math.hypot(inches[0], inches[1]) <= map.ring.outerRadius ? inches : null)
  }

  return (
    <figure className="space-y-1">
      <svg
        ref={svg}
        viewBox={`${-radius} ${-radius} ${2 * radius} ${2 * radius}`}
        className="h-72 w-72 cursor-crosshair rounded border border-linen-200 bg-white"
        role="img"
        aria-label="The ring's areas: click the place the report is about"
        data-testid="report-map"
        onClick={pick}
      >
        <g transform="scale(1,-1)">
          {shapes.map((shape) => (
            <polygon key={shape.key} points={shape.points} fill={shape.first ? '#f1e9d6' : '#faf7f0'} stroke="#8b8172" strokeWidth={radius / 300} />
          ))}
        </g>
        {map.areas.map((area) =>
          area.label ? (
            <text key={area.label} x={area.point[0]} y={-area.point[1]} fontSize={radius / 18} textAnchor="middle" dominantBaseline="middle" fill="#3d4a42">
              {area.label}
            </text>
          ) : null,
        )}
        {point && <circle cx={point[0]} cy={-point[1]} r={radius / 40} fill="#b5523b" stroke="white" strokeWidth={radius / 200} />}
      </svg>
      <figcaption className="text-xs text-stone-600">
        {point ? `Point (${point[0]}, ${point[1]}) in, ${pickedArea ? `in area ${pickedArea}` : 'outside the labelled areas'}.` : 'Click the ring to mark a point, or leave it unmarked.'}{' '}
        {point && (
          <button type="button" className="text-thread-700 underline" onClick={() => onPick(null)}>
            Clear the point
          </button>
        )}
      </figcaption>
    </figure>
  )
}
