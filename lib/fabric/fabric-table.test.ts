import Papa from 'papaparse'
import { describe, expect, it } from 'vitest'
import { fabricRequirements, planDesign } from '@/geometry'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import {
  CSV_FIELDS, cuttingSettingsFrom, fabricCsv, fabricCsvFileName, fabricRows, fabricTotals, formatMetres, formatYards, sortFabricRows, type FabricRow,
} from './fabric-table'

const row = (overrides: Partial<FabricRow>): FabricRow => ({
  fabric: 'background', name: 'Cream tone-on-tone', color: '#f6eddc', pieces: 12, lengthIn: 6.75, yards: 0.25, metres: 0.2, fatQuarter: true, fatEighth: false, ...overrides,
})

const rows: FabricRow[] = [
  row({ fabric: 'background', name: 'Cream tone-on-tone', color: '#f6eddc', pieces: 12, yards: 0.25, metres: 0.2, fatQuarter: true, fatEighth: false }),
  row({ fabric: 'leaf-dark', name: 'Pine batik', color: '#2f5540', pieces: 32, yards: 0.125, metres: 0.1, fatQuarter: true, fatEighth: true }),
  row({ fabric: 'binding', name: 'binding', color: null, pieces: 1, yards: 0.5, metres: 0.5, fatQuarter: true, fatEighth: false }),
  row({ fabric: 'berry', name: 'berry red', color: '#a3392b', pieces: 24, yards: 0.125, metres: 0.1, fatQuarter: true, fatEighth: true }),
]

function demoWreath() {
  const parsed = parseDesign(DEMO_PATTERNS.find((p) => p.design.name === 'Hollyberry Wreath')!.design)
  if (!parsed.ok) throw new Error('the demo wreath does not parse')
  return parsed.design
}

describe('fabricRows', () => {
  it('gives one row per fabric with its pieces counted and the core’s yards, metres and precuts', () => {
    const wreath = demoWreath()
    const requirements = fabricRequirements(wreath, planDesign(wreath), wreath.colorways[0]!)
    const table = fabricRows(requirements)
    expect(table.map((r) => r.fabric)).toEqual(requirements.fabrics.map((f) => f.fabric))
    for (const [index, fabric] of requirements.fabrics.entries()) {
      // Pieces = every straight-grain piece, count expanded: one cut each in the layout.
      expect(table[index]!.pieces).toBe(fabric.cuts.length)
      expect(table[index]!.name).toBe(fabric.name)
      expect([table[index]!.yards, table[index]!.metres, table[index]!.fatQuarter]).toEqual([fabric.yards, fabric.metres, fabric.fatQuarter])
    }
  })
})

describe('sortFabricRows', () => {
  it('sorts by each column both ways, ties in name order, and leaves the input alone', () => {
    const before = rows.map((r) => r.fabric)
    expect(sortFabricRows(rows, 'name', 'ascending').map((r) => r.name)).toEqual(['berry red', 'binding', 'Cream tone-on-tone', 'Pine batik'])
    expect(sortFabricRows(rows, 'name', 'descending').map((r) => r.name)).toEqual(['Pine batik', 'Cream tone-on-tone', 'binding', 'berry red'])
    expect(sortFabricRows(rows, 'pieces', 'ascending').map((r) => r.pieces)).toEqual([1, 12, 24, 32])
    // 1/8 yd twice: the tie goes by name.
    expect(sortFabricRows(rows, 'yards', 'descending').map((r) => r.name)).toEqual(['binding', 'Cream tone-on-tone', 'berry red', 'Pine batik'])
    expect(sortFabricRows(rows, 'metres', 'ascending').map((r) => r.metres)).toEqual([0.1, 0.1, 0.2, 0.5])
    // Swatches dark to light; a fabric without a colour last.
    expect(sortFabricRows(rows, 'color', 'ascending').map((r) => r.color)).toEqual(['#2f5540', '#a3392b', '#f6eddc', null])
    // "no" before "yes".
    expect(sortFabricRows(rows, 'fatEighth', 'ascending').map((r) => r.fatEighth)).toEqual([false, false, true, true])
    expect(sortFabricRows(rows, 'fatQuarter', 'descending')).toHaveLength(4)
    expect(rows.map((r) => r.fabric)).toEqual(before)
  })
})

describe('fabricTotals', () => {
  it('adds pieces, yards and metres and counts the fabrics a precut will do for', () => {
    // 12 + 32 + 1 + 24 = 69 pieces; 1/4 + 1/8 + 1/2 + 1/8 = 1 yd; 0.2 + 0.1 + 0.5 + 0.1 = 0.9 m (summed in tenths, not 0.8999…).
    expect(fabricTotals(rows)).toEqual({ fabrics: 4, pieces: 69, yards: 1, metres: 0.9, fatQuarters: 4, fatEighths: 2 })
    expect(fabricTotals([])).toEqual({ fabrics: 0, pieces: 0, yards: 0, metres: 0, fatQuarters: 0, fatEighths: 0 })
  })
})

describe('the trade’s words', () => {
  it('writes yards in eighths reduced, as bought at the cutting counter (1/8 yd steps, common practice)', () => {
    expect(formatYards(0.125)).toBe('1/8 yd')
    expect(formatYards(0.375)).toBe('3/8 yd')
    expect(formatYards(0.5)).toBe('1/2 yd')
    expect(formatYards(1)).toBe('1 yd')
    expect(formatYards(1.25)).toBe('1 1/4 yd')
    expect(formatYards(2.875)).toBe('2 7/8 yd')
    expect(formatYards(0)).toBe('0 yd')
    expect(formatMetres(0.3)).toBe('0.3 m')
    expect(formatMetres(1)).toBe('1.0 m')
  })
})

describe('cuttingSettingsFrom', () => {
  it('reads the width of fabric in the design’s units and the extra in percent', () => {
    expect(cuttingSettingsFrom({ widthOfFabric: '40', extraPercent: '10' }, 'in')).toEqual({ ok: true, widthOfFabricIn: 40, extraPercent: 10 })
    // 1 in = 2.54 cm exactly (1959 agreement): 101.6 cm = 40 in.
    const metric = cuttingSettingsFrom({ widthOfFabric: '101.6', extraPercent: '0' }, 'cm')
    expect(metric.ok && metric.widthOfFabricIn).toBeCloseTo(40, 12)
    expect(cuttingSettingsFrom({ widthOfFabric: '304.8', extraPercent: '5' }, 'cm').ok).toBe(true)
    expect(cuttingSettingsFrom({ widthOfFabric: '', extraPercent: '10' }, 'in')).toEqual({ ok: false, message: 'The usable width of fabric must be between 10 and 120 in.' })
    expect(cuttingSettingsFrom({ widthOfFabric: '5', extraPercent: '10' }, 'cm')).toEqual({ ok: false, message: 'The usable width of fabric must be between 25.4 and 304.8 cm.' })
    expect(cuttingSettingsFrom({ widthOfFabric: '40', extraPercent: '-1' }, 'in')).toEqual({ ok: false, message: 'The extra must be between 0 and 100 %.' })
    expect(cuttingSettingsFrom({ widthOfFabric: '40', extraPercent: 'ten' }, 'in').ok).toBe(false)
  })
})

describe('fabricCsv', () => {
  it('writes a header and one row per fabric that papaparse reads back to the same values', () => {
    const csv = fabricCsv('Snowberry Dusk', rows)
    const parsed = Papa.parse<string[]>(csv, { skipEmptyLines: true })
    expect(parsed.errors).toEqual([])
    const [header, ...data] = parsed.data
    expect(header).toEqual([...CSV_FIELDS])
    expect(data).toEqual(rows.map((r) => ['Snowberry Dusk', r.name, r.color ?? '', String(r.pieces), String(r.yards), String(r.metres), r.fatQuarter ? 'yes' : 'no', r.fatEighth ? 'yes' : 'no']))
  })

  it('quotes commas and quotes in names and keeps a name from running as a spreadsheet formula', () => {
    const tricky = [row({ name: 'Cream, "tone" on tone' }), row({ name: '=HYPERLINK("x")' })]
    const csv = fabricCsv('A, B', tricky)
    const [, first, second] = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data
    expect(first!.slice(0, 2)).toEqual(['A, B', 'Cream, "tone" on tone'])
    // papaparse's escapeFormulae prefixes a single quote (OWASP's advice for CSV injection).
    expect(second![1]).toBe(`'=HYPERLINK("x")`)
  })

  it('names the file for the pattern and the colourway', () => {
    expect(fabricCsvFileName('Hollyberry Wreath', 'Snowberry Dusk')).toBe('hollyberry-wreath-snowberry-dusk-fabric.csv')
    expect(fabricCsvFileName('***', '')).toBe('pattern-fabric.csv')
  })
})
