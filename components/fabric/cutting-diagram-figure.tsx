/**
 * One fabric's cutting diagram as SVG, drawn to scale in inches (the view box is the usable width
 * of fabric by the layout's length): each strip across the width, its sub-cuts filled with the
 * fabric's colour and labelled by what they are for, turned pieces marked with a corner notch.
 * Beside it the same strips in words, so a screen reader (and a maker at the cutting table) gets
 * everything the picture shows, under the fabric's name and its swatch image (when it has one).
 * Data from lib/fabric/cutting-diagram.ts, as the booklet's.
 */
import { useId } from 'react'
import type { CuttingDiagram } from '@/lib/fabric/cutting-diagram'
import { formatLength, formatSize, type LengthUnits } from '@/lib/units'
import { SwatchImage } from './swatch-image'

/** Room above the strips for the width's label, inches of the drawing. */
const TOP_IN = 1.6

/** Black or white, whichever reads better on a fill (BT.709 luma). */
function inkOn(color: string | null): string {
  if (!color || !/^#[0-9a-fA-F]{6}$/.test(color)) return '#1c1917'
  const [r, g, b] = [1, 3, 5].map((at) => parseInt(color.slice(at, at + 2), 16))
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b! > 140 ? '#1c1917' : '#ffffff'
}

/** A label's size, inches: as large as fits the piece, never more than 0.9 in. */
function labelSize(label: string, widthIn: number, heightIn: number): number {
  return Math.max(0.15, Math.min(0.9, heightIn * 0.45, (widthIn * 0.85) / Math.max(1, label.length * 0.6)))
}

/**
 * The diagram of one fabric, with a list of its strips beside it.
 *
 * @example <CuttingDiagramFigure diagram={cuttingDiagram(fabric, 40, 'in')} units="in" swatch={colorway.fabrics[fabric.fabric]?.swatch} />
 */
export function CuttingDiagramFigure({ diagram, units, swatch }: { diagram: CuttingDiagram; units: LengthUnits; swatch?: string | undefined }) {
  const id = useId()
  const width = diagram.widthOfFabricIn
  const length = Math.max(diagram.lengthIn, 0.5)
  const ink = inkOn(diagram.color)
  const fill = diagram.color ?? '#d4d4d4'
  return (
    <figure className="grid gap-4 break-inside-avoid md:grid-cols-[minmax(0,3fr)_minmax(0,2fr)]" data-testid="cutting-diagram" data-fabric={diagram.fabric}>
      <svg
        role="img"
        aria-labelledby={`${id}-title`}
        aria-describedby={`${id}-list`}
        viewBox={`-0.2 0 ${width + 0.4} ${length + TOP_IN + 0.2}`}
        className="h-auto w-full max-h-[36rem] rounded border border-stone-200 bg-white print:max-h-none"
        preserveAspectRatio="xMinYMin meet"
      >
        <title id={`${id}-title`}>{`Cutting diagram, ${diagram.title}`}</title>
        <text x={width / 2} y={0.9} fontSize={0.7} textAnchor="middle" fill="#57534e">
          {`← usable width of fabric, ${formatLength(width, units)} →`}
        </text>
        <g transform={`translate(0 ${TOP_IN})`}>
          {diagram.strips.map((strip) => (
            <g key={strip.number} data-strip={strip.number}>
              {/* The strip as cut across the width; what no piece covers shows as waste. */}
              <rect x={0} y={strip.yIn} width={width} height={strip.heightIn} fill="#f5f5f4" stroke="#78716c" strokeWidth={0.06} strokeDasharray="0.3 0.2" />
              {strip.cuts.map((cut, index) => (
                <g key={index}>
                  <rect
                    data-cut={cut.label}
                    data-turned={cut.turned ? 'true' : undefined}
                    x={cut.xIn}
                    y={cut.yIn}
                    width={cut.widthIn}
                    height={cut.heightIn}
                    fill={fill}
                    stroke="#292524"
                    strokeWidth={0.05}
                  >
                    <title>{`${cut.label}, ${formatSize(cut.widthIn, cut.heightIn, units)}${cut.turned ? ', turned' : ''}`}</title>
                  </rect>
                  {cut.turned && (
                    <path d={`M ${cut.xIn + cut.widthIn - Math.min(0.5, cut.widthIn / 3, cut.heightIn / 3)} ${cut.yIn} h ${Math.min(0.5, cut.widthIn / 3, cut.heightIn / 3)} v ${Math.min(0.5, cut.widthIn / 3, cut.heightIn / 3)} z`} fill={ink} aria-hidden="true" />
                  )}
                  <text
                    x={cut.xIn + cut.widthIn / 2}
                    y={cut.yIn + cut.heightIn / 2}
                    fontSize={labelSize(cut.label, cut.widthIn, cut.heightIn)}
                    textAnchor="middle"
                    dominantBaseline="central"
                    fill={ink}
                    aria-hidden="true"
                  >
                    {cut.label}
                  </text>
                </g>
              ))}
            </g>
          ))}
        </g>
      </svg>
      <figcaption className="space-y-2 text-sm">
        <p className="flex items-center gap-2 font-medium text-stone-800">
          {swatch && <SwatchImage upload={swatch} name={diagram.name} className="h-6 w-6" />}
          {diagram.title}
        </p>
        <ol id={`${id}-list`} className="list-none space-y-1 text-stone-700">
          {diagram.strips.map((strip) => (
            <li key={strip.number}>{strip.words}</li>
          ))}
        </ol>
        <p className="text-xs text-stone-500">A notch in a corner marks a piece turned 90° from the size asked for. Grey shows what is left of a strip.</p>
      </figcaption>
    </figure>
  )
}
