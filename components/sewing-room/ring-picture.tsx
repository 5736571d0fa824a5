import type { SewingPicture } from '@/lib/schemas/sewing-room'
import { areaKey } from '@/lib/sewing-room-client/merge'

/** Unsewn paper, and its printed line: the colours of a foundation before any fabric is on it. */
const PAPER = '#fffdf7'
const PRINTED_LINE = '#a8a29e'
const NEXT_LINE = '#23402f'

/**
 * The ring as it stands: every area of every repeat, those sewn in their fabric's colour, the rest
 * as the paper foundation with its printed line; the next step's areas outlined in thread green;
 * finishing (leaves, stem ring, curls, berries, binding) drawn once its step is done. Colours are
 * SVG presentation attributes, which the page's Content-Security-Policy does not govern.
 */
export function RingPicture({
  picture,
  sewn,
  next,
  finishing,
  caption,
}: {
  picture: SewingPicture
  sewn: ReadonlySet<string>
  next: ReadonlySet<string>
  finishing: SewingPicture['finishing'][number][]
  caption: string
}) {
  const repeats = [...new Set(picture.areas.map((area) => area.repeat))].sort((a, b) => a - b)
  return (
    <svg
      viewBox={picture.viewBox.join(' ')}
      role="img"
      aria-label={caption}
      data-testid="ring-picture"
      className="mx-auto block aspect-square w-full max-w-md"
      preserveAspectRatio="xMidYMid meet"
    >
      {repeats.map((repeat) => (
        <g key={repeat} data-repeat={repeat}>
          {picture.areas
            .filter((area) => area.repeat === repeat)
            .map((area) => {
              const key = areaKey(area.repeat, area.id)
              const isSewn = sewn.has(key)
              return (
                <polygon
                  key={key}
                  points={area.points.map(([x, y]) => `${x},${y}`).join(' ')}
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
        {picture.areas
          .filter((area) => next.has(areaKey(area.repeat, area.id)))
          .map((area) => (
            <polygon
              key={areaKey(area.repeat, area.id)}
              points={area.points.map(([x, y]) => `${x},${y}`).join(' ')}
              fill="none"
              stroke={NEXT_LINE}
              strokeWidth={3}
              strokeDasharray="6 4"
              strokeLinejoin="round"
              vectorEffect="non-scaling-stroke"
            />
          ))}
      </g>
      <g data-testid="finishing">
        {finishing.map((item, index) => (
          <path
            key={`${item.stepId}-${index}`}
            d={item.d}
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
