'use client'

/**
 * The fabric page's working part: a colourway, the cutting settings, the fabric table (sortable,
 * with totals, printable, downloadable as CSV), the leaf preparation list, the bias strips and a
 * cutting diagram per fabric. Everything is computed here, in the browser, from the saved design
 * with the core's `fabricRequirements`, so changing a setting answers at once.
 */
import { useMemo, useState } from 'react'
import { fabricRequirements, planDesign, type Design } from '@/geometry'
import { cuttingDiagram } from '@/lib/fabric/cutting-diagram'
import {
  cuttingSettingsFrom, fabricCsv, fabricCsvFileName, fabricRows, fabricTotals, FABRIC_COLUMNS, FABRIC_COLUMN_TITLES, formatMetres, formatYards, sortFabricRows,
  type FabricColumn, type SortDirection,
} from '@/lib/fabric/fabric-table'
import { leafPreparation } from '@/lib/fabric/leaf-preparation'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'
import { formatLength, formatSize, inchesToCentimetres, type LengthUnits } from '@/lib/units'
import { downloadFile } from '@/components/ui/download'
import { CuttingDiagramFigure } from './cutting-diagram-figure'
import { SwatchImage } from './swatch-image'

const yesNo = (value: boolean): string => (value ? 'yes' : 'no')

/** The fabric's swatch image when it has one, beside its colour chip. */
function Swatch({ color, name, swatch }: { color: string | null; name: string; swatch: string | undefined }) {
  return (
    <span className="inline-flex items-center gap-1.5">
      {swatch && <SwatchImage upload={swatch} name={name} />}
      {color ? (
        <span className="inline-block h-5 w-8 rounded border border-stone-400 align-middle print:[print-color-adjust:exact]" style={{ backgroundColor: color }} role="img" aria-label={`${name}: colour ${color}`} />
      ) : (
        <span className="text-xs text-stone-500">no colour chosen</span>
      )}
    </span>
  )
}

/**
 * The fabric screen for one pattern's saved design.
 *
 * @example <FabricScreen name="Hollyberry Wreath" design={pattern.design} />
 */
export function FabricScreen({ name, design: file }: { name: string; design: DesignFile }) {
  const parsed = useMemo(() => parseDesign(file), [file])
  if (!parsed.ok) {
    return <p role="alert" className="text-madder-700">The saved design has a problem at {parsed.issues[0]?.path}: {parsed.issues[0]?.message}</p>
  }
  return <FabricWorkspace name={name} design={parsed.design} units={file.units} />
}

function FabricWorkspace({ name, design, units }: { name: string; design: Design; units: LengthUnits }) {
  const plan = useMemo(() => planDesign(design, { suggestions: false }), [design])
  const [colorwayName, setColorwayName] = useState(design.colorways[0]?.name ?? '')
  const [widthOfFabric, setWidthOfFabric] = useState(units === 'cm' ? String(Math.round(inchesToCentimetres(40) * 10) / 10) : '40')
  const [extraPercent, setExtraPercent] = useState('10')
  const [sort, setSort] = useState<{ column: FabricColumn; direction: SortDirection } | null>(null)
  const colorway = design.colorways.find((candidate) => candidate.name === colorwayName) ?? design.colorways[0] ?? null
  const settings = cuttingSettingsFrom({ widthOfFabric, extraPercent }, units)
  // The last good settings stay in force while a field is being typed into.
  const [lastGood, setLastGood] = useState({ widthOfFabricIn: 40, extraPercent: 10 })
  const changeSettings = (form: { widthOfFabric: string; extraPercent: string }): void => {
    setWidthOfFabric(form.widthOfFabric)
    setExtraPercent(form.extraPercent)
    const next = cuttingSettingsFrom(form, units)
    if (next.ok) setLastGood({ widthOfFabricIn: next.widthOfFabricIn, extraPercent: next.extraPercent })
  }
  const requirements = useMemo(() => fabricRequirements(design, plan, colorway, lastGood), [design, plan, colorway, lastGood])
  const rows = useMemo(() => fabricRows(requirements), [requirements])
  const shown = sort ? sortFabricRows(rows, sort.column, sort.direction) : rows
  const totals = fabricTotals(rows)
  const leaves = leafPreparation(requirements)
  const colorwayLabel = colorway?.name ?? 'no colourway'

  const sortBy = (column: FabricColumn): void =>
    setSort((current) => ({ column, direction: current?.column === column && current.direction === 'ascending' ? 'descending' : 'ascending' }))

  return (
    <div className="space-y-8">
      <form className="flex flex-wrap items-end gap-6 print:hidden" onSubmit={(event) => event.preventDefault()} aria-label="Fabric settings">
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-stone-700">Colourway</span>
          <select className="rounded border border-stone-300 bg-white px-2 py-1" value={colorway?.name ?? ''} onChange={(event) => setColorwayName(event.target.value)} disabled={design.colorways.length === 0}>
            {design.colorways.length === 0 && <option value="">No colourway yet</option>}
            {design.colorways.map((candidate) => (
              <option key={candidate.name} value={candidate.name}>
                {candidate.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-stone-700">Usable width of fabric ({units})</span>
          <input className="w-28 rounded border border-stone-300 px-2 py-1" inputMode="decimal" value={widthOfFabric} onChange={(event) => changeSettings({ widthOfFabric: event.target.value, extraPercent })} aria-describedby="fabric-settings-status" />
        </label>
        <label className="flex flex-col gap-1 text-sm">
          <span className="font-medium text-stone-700">Extra (%)</span>
          <input className="w-20 rounded border border-stone-300 px-2 py-1" inputMode="decimal" value={extraPercent} onChange={(event) => changeSettings({ widthOfFabric, extraPercent: event.target.value })} aria-describedby="fabric-settings-status" />
        </label>
        <div className="flex gap-3">
          <button type="button" className="rounded bg-thread-700 px-4 py-2 text-sm text-white hover:bg-thread-800" onClick={() => downloadFile(fabricCsv(colorwayLabel, shown), fabricCsvFileName(name, colorway?.name ?? ''), 'text/csv;charset=utf-8')}>
            Download CSV
          </button>
          <button type="button" className="rounded border border-stone-300 px-4 py-2 text-sm hover:bg-linen-100" onClick={() => window.print()}>
            Print
          </button>
        </div>
        <p id="fabric-settings-status" role="status" className="w-full text-sm text-madder-700">
          {settings.ok ? '' : `${settings.message} Showing ${formatLength(lastGood.widthOfFabricIn, units)} and ${lastGood.extraPercent} % until then.`}
        </p>
      </form>

      <p className="text-sm text-stone-600">
        Quilting cotton is sold about 42–45 in wide, about 40 in of it usable once the selvedges are off. Amounts are the strips’ length plus {lastGood.extraPercent} % extra, rounded up to the next 1/8 yd (4 1/2 in) or 10 cm, as shops cut. A fat quarter is 18 × 21 in, a fat eighth 9 × 21 in.
      </p>

      {requirements.problems.length > 0 && (
        <ul role="alert" className="space-y-1 rounded border border-madder-600 bg-white p-3 text-sm text-madder-700">
          {requirements.problems.map((problem, index) => (
            <li key={index}>{problem.message}</li>
          ))}
        </ul>
      )}

      <table className="w-full max-w-4xl border-collapse text-sm" data-testid="fabric-table">
        <caption className="mb-2 text-left text-lg font-semibold text-stone-800">Fabric for the {colorwayLabel} colourway</caption>
        <thead>
          <tr className="border-b border-stone-300 text-left">
            {FABRIC_COLUMNS.map((column) => (
              <th key={column} scope="col" className="px-2 py-1" aria-sort={sort?.column === column ? sort.direction : 'none'}>
                <button type="button" className="font-medium hover:underline print:no-underline" onClick={() => sortBy(column)}>
                  {FABRIC_COLUMN_TITLES[column]}
                  <span aria-hidden="true" className="print:hidden">{sort?.column === column ? (sort.direction === 'ascending' ? ' ▲' : ' ▼') : ''}</span>
                </button>
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {shown.map((row) => (
            <tr key={row.fabric} className="border-b border-stone-200" data-fabric={row.fabric} data-yards={row.yards} data-metres={row.metres}>
              <th scope="row" className="px-2 py-1 text-left font-normal">{row.name}</th>
              <td className="px-2 py-1"><Swatch color={row.color} name={row.name} swatch={colorway?.fabrics[row.fabric]?.swatch} /></td>
              <td className="px-2 py-1 tabular-nums">{row.pieces}</td>
              <td className="px-2 py-1 tabular-nums">{formatYards(row.yards)}</td>
              <td className="px-2 py-1 tabular-nums">{formatMetres(row.metres)}</td>
              <td className="px-2 py-1">{yesNo(row.fatQuarter)}</td>
              <td className="px-2 py-1">{yesNo(row.fatEighth)}</td>
            </tr>
          ))}
        </tbody>
        <tfoot>
          <tr className="border-t-2 border-stone-400 font-medium" data-testid="fabric-totals">
            <th scope="row" className="px-2 py-1 text-left">Total, {totals.fabrics} fabric{totals.fabrics === 1 ? '' : 's'}</th>
            <td className="px-2 py-1" />
            <td className="px-2 py-1 tabular-nums">{totals.pieces}</td>
            <td className="px-2 py-1 tabular-nums">{formatYards(totals.yards)}</td>
            <td className="px-2 py-1 tabular-nums">{formatMetres(totals.metres)}</td>
            <td className="px-2 py-1">{totals.fatQuarters} of {totals.fabrics}</td>
            <td className="px-2 py-1">{totals.fatEighths} of {totals.fabrics}</td>
          </tr>
        </tfoot>
      </table>

      <section aria-labelledby="leaf-preparation-heading" className="space-y-2 break-inside-avoid">
        <h2 id="leaf-preparation-heading" className="text-lg font-semibold">Leaf preparation</h2>
        {leaves.length === 0 ? (
          <p className="text-sm text-stone-600">This design has no folded leaves.</p>
        ) : (
          <>
            <p className="max-w-2xl text-sm text-stone-600">Cut, fold and press every leaf before you start sewing: each folded leaf is two pieces cut with its template, sewn and turned.</p>
            <ul className="space-y-2 text-sm" data-testid="leaf-preparation">
              {leaves.map((batch) => (
                <li key={batch.fabric} data-fabric={batch.fabric}>
                  <span className="font-medium">{batch.name}</span>: {batch.leaves} folded leaves, {batch.pieces} pieces
                  <ul className="ml-5 list-disc text-stone-700">
                    {batch.sizes.map((size, index) => (
                      <li key={index}>
                        {size.leaves} leaves from pieces {formatSize(size.widthIn, size.heightIn, units)} ({size.pieces} pieces)
                      </li>
                    ))}
                  </ul>
                </li>
              ))}
            </ul>
          </>
        )}
      </section>

      <section aria-labelledby="bias-heading" className="space-y-2 break-inside-avoid">
        <h2 id="bias-heading" className="text-lg font-semibold">Bias strips</h2>
        <ul className="space-y-1 text-sm text-stone-700">
          {requirements.stems.map((stem, index) => (
            <li key={index}>
              Stem ring: {formatLength(stem.lengthIn, units)} of bias {formatLength(stem.cutWidthIn, units)} wide from {stem.squares} square{stem.squares === 1 ? '' : 's'} of {formatLength(stem.squareIn, units)} ({requirements.fabrics.find((fabric) => fabric.fabric === stem.fabric)?.name ?? stem.fabric}).
            </li>
          ))}
          <li>
            Binding: {formatLength(requirements.binding.lengthIn, units)} of bias {formatLength(requirements.binding.cutWidthIn, units)} wide from {requirements.binding.squares} square{requirements.binding.squares === 1 ? '' : 's'} of {formatLength(requirements.binding.squareIn, units)} ({requirements.fabrics.find((fabric) => fabric.fabric === requirements.binding.fabric)?.name ?? requirements.binding.fabric}).
          </li>
        </ul>
      </section>

      <section aria-labelledby="diagrams-heading" className="space-y-6">
        <h2 id="diagrams-heading" className="text-lg font-semibold print:break-before-page">Cutting diagrams</h2>
        <p className="max-w-2xl text-sm text-stone-600">Each fabric laid flat, the usable width across: cut each strip across the width, then sub-cut it as labelled. Every cut runs straight from edge to edge.</p>
        {requirements.fabrics.map((fabric) => (
          <CuttingDiagramFigure key={fabric.fabric} diagram={cuttingDiagram(fabric, requirements.widthOfFabricIn, units)} units={units} swatch={colorway?.fabrics[fabric.fabric]?.swatch} />
        ))}
      </section>
    </div>
  )
}
