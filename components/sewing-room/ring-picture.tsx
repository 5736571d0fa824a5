import type { SewingPicture, SvgMatrix } from '@/lib/schemas/sewing-room'
import { areaKey, type ShownOverlay } from '@/lib/sewing-room-client/merge'

/** Unsewn paper, and its printed line: the colours of a foundation before any fabric is on it. */
const PAPER = '#fffdf7'
const PRINTED_LINE = '#a8a29e'
const NEXT_LINE = '#23402f'

/** An SVG transform attribute for a matrix. */
const transformOf = (matrix: SvgMatrix): string => `matrix(${matrix.join(' ')})`

/**
 * The ring as it stands: every area of every repeat (one repeat's shapes, placed by each repeat's
 * matrix), those sewn in their fabric's colour, the rest as the paper foundation with its printed
 * line; the next step's areas outlined in thread green; what is laid over them (leaves, stem ring,
 * curls, berries, binding) drawn once its step is done. Colours are SVG presentation attributes,
 * which the page's Content-Security-Policy does not govern.
 */
export function RingPicture({
  picture,
  sewn,
  next,
  overlays,
  caption,
}: {
  picture: SewingPicture
  sewn: ReadonlySet<string>
  next: ReadonlySet<string>
  overlays: readonly ShownOverlay[]
  caption: string
}) {
  const shapes = picture.areas.map((area) => ({ ...area, points: area.points.map(([x, y]) => `${x},${y}`).join(' ') }))
  return (
    <svg
      viewBox={picture.viewBox.join(' ')}
      role="img"
      aria-label={caption}
      data-testid="ring-picture"
      className="mx-auto block aspect-square w-full max-w-md"
      preserveAspectRatio="xMidYMid meet"
    >
      {picture.repeats.map(({ repeat, matrix }) => (
        <g key={repeat} data-repeat={repeat} transform={transformOf(matrix)}>
          {shapes.map((area) => {
            const isSewn = sewn.has(areaKey(repeat, area.id))
            return (
              <polygon
                key={area.id}
                points={area.points}
                fill={isSewn ? area.fill : PAPER}
                stroke={isSewn ? '#ffffff' : PRINTED_LINE}
                strokeWidth={isSewn ? 0.75 : 1}
                strokeLinejoin="round"
                vectorEffect="non-scaling-stroke"
                data-sewn={isSewn ? 'true' : 'false'}
                className="transition-[fill] duration-500"
              />
            )
          })}
        </g>
      ))}
      {/* The next step's areas over every other, so their outline is never hidden by a neighbour's. */}
      <g aria-hidden="true">
        {picture.repeats.flatMap(({ repeat, matrix }) =>
          shapes
            .filter((area) => next.has(areaKey(repeat, area.id)))
            .map((area) => (
              <polygon
                key={areaKey(repeat, area.id)}
                points={area.points}
                transform={transformOf(matrix)}
                fill="none"
                stroke={NEXT_LINE}
                strokeWidth={3}
                strokeDasharray="6 4"
                strokeLinejoin="round"
                vectorEffect="non-scaling-stroke"
              />
            )),
        )}
      </g>
      <g data-testid="finishing">
        {overlays.map((item) => (
          <path
            key={item.key}
            d={item.d}
            transform={item.matrix ? transformOf(item.matrix) : undefined}
            fill={item.fill ?? 'none'}
            stroke={item.stroke ?? 'none'}
            // Without a width of its own (inches), a line is drawn 1.5 px wide at any zoom.
            strokeWidth={item.strokeWidthIn ?? 1.5}
            vectorEffect={item.strokeWidthIn === undefined ? 'non-scaling-stroke' : undefined}
            strokeLinecap="round"
            strokeLinejoin="round"
            data-step={item.stepId}
          />
        ))}
      </g>
    </svg>
  )
}
