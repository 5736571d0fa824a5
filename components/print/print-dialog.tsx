'use client'

/**
 * The print room's dialog: paper, orientation, colourway, finished size, the usable width of
 * fabric and extra the amounts are worked out for, and the parts to include,
 * beside a preview of the booklet's pages. The booklet is built here, in the browser, with the same
 * lib/booklet code the command line uses, so a large booklet never holds up the server for anyone
 * else; it is rebuilt a moment after the options change, and the download saves the bytes shown.
 */
import { useEffect, useMemo, useState, type FormEvent } from 'react'
import { PAPERS } from '@/lib/booklet/paper'
import { footerLine, type FooterNotice } from '@/lib/booklet/chrome'
import type { SwatchImages } from '@/lib/booklet/swatches'
import { DEFAULT_EXTRA_PERCENT, DEFAULT_WIDTH_OF_FABRIC_INCHES } from '@/geometry/yardage'
import { PAPER_NAMES, DEFAULT_MARGIN_INCHES, DEFAULT_OVERLAP_INCHES, type BookletPart, type PaperName } from '@/lib/schemas/booklet'
import { parseDesign, type DesignFile } from '@/lib/schemas/design'
import { downloadFile } from '@/components/ui/download'
import { BookletPreview } from './booklet-preview'
import { ALL_PARTS, bookletFileName, lengthInUnits, PART_TITLES, printOptionsFrom } from './print-options'
import { fetchSwatchImages, swatchUrls } from './swatch-images'
import { optionsKey, useBookletPreview } from './use-booklet-preview'

/**
 * The print dialog for one pattern's design. `footer`: a notice with a person's name printed on
 * every page (a tester's "test copy – not for sale"), said above the download button.
 *
 * @example <PrintDialog name="Hollyberry Wreath" design={pattern.design} />
 */
export function PrintDialog({ name, design, footer }: { name: string; design: DesignFile; footer?: FooterNotice }) {
  const colorways = design.colorways ?? []
  const [paper, setPaper] = useState<PaperName>('letter')
  const [orientation, setOrientation] = useState<'portrait' | 'landscape'>('portrait')
  const [colorway, setColorway] = useState(colorways[0]?.name ?? '')
  const [diameter, setDiameter] = useState(String(2 * design.ring.outerRadius))
  const [parts, setParts] = useState<BookletPart[]>([...ALL_PARTS])
  const [margin, setMargin] = useState(String(DEFAULT_MARGIN_INCHES))
  const [overlap, setOverlap] = useState(String(DEFAULT_OVERLAP_INCHES))
  const [widthOfFabric, setWidthOfFabric] = useState(lengthInUnits(DEFAULT_WIDTH_OF_FABRIC_INCHES, design.units))
  const [extraPercent, setExtraPercent] = useState(String(DEFAULT_EXTRA_PERCENT))
  // Said beside the button until the options change.
  const [downloaded, setDownloaded] = useState<{ key: string; text: string } | null>(null)

  const toggle = (part: BookletPart): void =>
    setParts((current) => (current.includes(part) ? current.filter((p) => p !== part) : [...current, part]))

  const parsed = useMemo(() => parseDesign(design), [design])
  const options = useMemo(
    () => printOptionsFrom({ paper, orientation, colorway, diameter, units: design.units, parts, margin, overlap, widthOfFabric, extraPercent }),
    [paper, orientation, colorway, diameter, design.units, parts, margin, overlap, widthOfFabric, extraPercent],
  )
  const problem = !parsed.ok
    ? `The saved design has a problem at ${parsed.issues[0]?.path}: ${parsed.issues[0]?.message}`
    : options.ok ? null : options.message
  // The chosen colourway's swatch images, fetched once per colourway; the booklet is built without
  // them until they arrive (and shows colour chips for any that do not).
  const chosen = parsed.ok ? (parsed.design.colorways.find((c) => c.name === colorway) ?? parsed.design.colorways[0] ?? null) : null
  const swatchSources = JSON.stringify(swatchUrls(chosen))
  const [swatches, setSwatches] = useState<{ sources: string; images: SwatchImages } | null>(null)
  useEffect(() => {
    if (swatchSources === '[]') return
    const controller = new AbortController()
    void fetchSwatchImages(chosen, controller.signal).then((images) => {
      if (!controller.signal.aborted) setSwatches({ sources: swatchSources, images })
    })
    return () => controller.abort()
    // `chosen` is read for the sources it names, which `swatchSources` stands for.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [swatchSources])
  const swatchImages = swatches?.sources === swatchSources ? swatches.images : undefined
  const swatchCount = (JSON.parse(swatchSources) as unknown[]).length
  const swatchNote = swatchCount === 0
    ? null
    : !swatchImages
      ? 'Loading the swatch images of this colourway…'
      : swatchNoteCount(Object.keys(swatchImages).length, swatchCount)
  const preview = useBookletPreview(parsed.ok ? parsed.design : null, options.ok ? options.options : null, problem, swatchImages, footer)
  const ready = preview.kind === 'built' && options.ok && preview.booklet.key === optionsKey(options.options, swatchImages) ? preview.booklet : null

  function onSubmit(event: FormEvent<HTMLFormElement>): void {
    event.preventDefault()
    if (!ready) return
    const fileName = bookletFileName(name, ready.options)
    // The very bytes the thumbnails were drawn from.
    downloadFile(ready.bytes.slice(), fileName, 'application/pdf')
    setDownloaded({ key: ready.key, text: `Downloaded ${fileName} (${ready.pages.length} pages).` })
  }

  const unit = design.units
  return (
    <div className="grid gap-8 lg:grid-cols-[minmax(0,24rem)_minmax(0,1fr)]">
      <form onSubmit={onSubmit} className="max-w-xl space-y-5" aria-describedby="print-status">
        <fieldset className="space-y-2">
          <legend className="text-sm font-medium text-stone-700">Paper</legend>
          <select
            id="print-paper"
            aria-label="Paper"
            value={paper}
            onChange={(event) => setPaper(event.target.value as PaperName)}
            className="rounded border border-stone-300 bg-white px-3 py-2"
          >
            {PAPER_NAMES.map((name) => (
              <option key={name} value={name}>
                {PAPERS[name].title}
              </option>
            ))}
          </select>
          <div className="flex gap-4 text-sm">
            {(['portrait', 'landscape'] as const).map((value) => (
              <label key={value} className="flex items-center gap-1">
                <input type="radio" name="orientation" value={value} checked={orientation === value} onChange={() => setOrientation(value)} />
                {value === 'portrait' ? 'Portrait' : 'Landscape'}
              </label>
            ))}
          </div>
        </fieldset>

        <div className="flex flex-col gap-1">
          <label htmlFor="print-colorway" className="text-sm font-medium text-stone-700">
            Colourway
          </label>
          <select
            id="print-colorway"
            value={colorway}
            onChange={(event) => setColorway(event.target.value)}
            disabled={colorways.length === 0}
            className="rounded border border-stone-300 bg-white px-3 py-2"
          >
            {colorways.length === 0 && <option value="">No colourway yet (fabrics print grey)</option>}
            {colorways.map((c) => (
              <option key={c.name} value={c.name}>
                {c.name}
              </option>
            ))}
          </select>
          {swatchNote && <p className="text-xs text-stone-500" data-testid="print-swatches">{swatchNote}</p>}
        </div>

        <div className="flex flex-col gap-1">
          <label htmlFor="print-diameter" className="text-sm font-medium text-stone-700">
            Finished diameter ({unit})
          </label>
          <input
            id="print-diameter"
            inputMode="decimal"
            value={diameter}
            onChange={(event) => setDiameter(event.target.value)}
            className="w-32 rounded border border-stone-300 bg-white px-3 py-2"
          />
          <p className="text-xs text-stone-500">Everything scales with it: foundations, templates and the cutting list.</p>
        </div>

        <fieldset className="space-y-1">
          <legend className="text-sm font-medium text-stone-700">Fabric amounts</legend>
          <div className="flex gap-4">
            <label className="flex flex-col gap-1 text-sm">
              Usable width of fabric ({unit})
              <input
                id="print-width-of-fabric"
                value={widthOfFabric}
                onChange={(event) => setWidthOfFabric(event.target.value)}
                inputMode="decimal"
                className="w-28 rounded border border-stone-300 bg-white px-2 py-1"
              />
            </label>
            <label className="flex flex-col gap-1 text-sm">
              Extra (%)
              <input
                id="print-extra"
                value={extraPercent}
                onChange={(event) => setExtraPercent(event.target.value)}
                inputMode="decimal"
                className="w-20 rounded border border-stone-300 bg-white px-2 py-1"
              />
            </label>
          </div>
          <p className="text-xs text-stone-500">What to buy and the cutting diagrams are worked out for this width, plus the extra, rounded up to 1/8 yd or 10 cm.</p>
        </fieldset>

        <fieldset className="space-y-1">
          <legend className="text-sm font-medium text-stone-700">Include</legend>
          {ALL_PARTS.map((part) => (
            <label key={part} className="flex items-center gap-2 text-sm">
              <input type="checkbox" checked={parts.includes(part)} onChange={() => toggle(part)} />
              {PART_TITLES[part]}
            </label>
          ))}
        </fieldset>

        <details className="text-sm">
          <summary className="cursor-pointer text-stone-700">Margin and overlap</summary>
          <div className="mt-2 flex gap-4">
            <label className="flex flex-col gap-1">
              Printer margin (in)
              <input value={margin} onChange={(event) => setMargin(event.target.value)} inputMode="decimal" className="w-24 rounded border border-stone-300 px-2 py-1" />
            </label>
            <label className="flex flex-col gap-1">
              Tile overlap (in)
              <input value={overlap} onChange={(event) => setOverlap(event.target.value)} inputMode="decimal" className="w-24 rounded border border-stone-300 px-2 py-1" />
            </label>
          </div>
        </details>

        <p className="text-sm text-stone-600">
          Print the booklet at 100 % (actual size) and check the 1 in and 2 cm test squares before you cut.
        </p>
        {footer && (
          <p className="text-sm text-stone-600" data-testid="print-footer">
            Every page says “{footerLine(footer)}” at its foot.
          </p>
        )}

        <button
          type="submit"
          disabled={!ready}
          className="rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800 disabled:opacity-60"
        >
          {ready ? `Download PDF (${ready.pages.length} page${ready.pages.length === 1 ? '' : 's'})` : 'Download PDF'}
        </button>

        {downloaded && downloaded.key === ready?.key && <p className="text-sm">{downloaded.text}</p>}
      </form>
      <BookletPreview state={preview} current={ready !== null} />
    </div>
  )
}

/**
 * What the dialog says about the swatch images it got.
 *
 * @example swatchNoteCount(2, 3) // '2 of 3 swatch images shown beside the fabric colours; the other shows its colour only.'
 */
function swatchNoteCount(loaded: number, wanted: number): string {
  if (loaded === wanted) return `${wanted === 1 ? 'The swatch image is' : `All ${wanted} swatch images are`} shown beside the fabric colours.`
  const missing = wanted - loaded
  return `${loaded} of ${wanted} swatch images shown beside the fabric colours; the other${missing === 1 ? ' shows its' : 's show their'} colour only.`
}
