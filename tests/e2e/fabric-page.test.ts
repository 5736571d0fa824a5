import fs from 'node:fs'
import Papa from 'papaparse'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fabricRequirements, planDesign } from '@/geometry'
import { CSV_FIELDS, formatYards } from '@/lib/fabric/fabric-table'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

/** The table's rows as shown: fabric role, name, yards (as data and as words), pieces. */
async function tableRows(page: Page) {
  return page.getByTestId('fabric-table').locator('tbody tr').evaluateAll((rows) =>
    rows.map((row) => ({
      fabric: row.getAttribute('data-fabric') ?? '',
      name: row.querySelector('th')?.textContent ?? '',
      yards: Number(row.getAttribute('data-yards')),
      yardsText: row.querySelectorAll('td')[2]?.textContent ?? '',
      pieces: Number(row.querySelectorAll('td')[1]?.textContent),
    })),
  )
}

describe('the fabric page', () => {
  it('shows what to buy per colourway, follows the width of fabric, draws a rect per cut and exports the table as CSV', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    await page.goto(`${baseUrl()}/patterns`)
    await page.getByRole('link', { name: 'Hollyberry Wreath' }).click()
    await page.getByRole('link', { name: 'Fabric and cutting' }).click()
    await page.getByTestId('fabric-table').waitFor()

    // What the core computes for the saved design, the check for what the screen shows.
    const id = new URL(page.url()).pathname.split('/')[2]!
    const saved = await page.evaluate(async (patternId) => (await fetch(`/api/patterns/${patternId}`)).json(), id)
    const parsed = parseDesign(saved.pattern.design)
    if (!parsed.ok) throw new Error('the demo wreath is not a valid design')
    const design = parsed.design
    const plan = planDesign(design)
    expect(design.colorways.length).toBeGreaterThanOrEqual(2)
    const [first, second] = design.colorways
    const expected = fabricRequirements(design, plan, first!)

    // Each fabric with its display name and the yards to buy, in the trade's eighths.
    const rows = await tableRows(page)
    expect(rows.map((row) => row.fabric)).toEqual(expected.fabrics.map((fabric) => fabric.fabric))
    expect(rows.map((row) => row.name)).toEqual(expected.fabrics.map((fabric) => fabric.name))
    expect(rows.map((row) => row.yards)).toEqual(expected.fabrics.map((fabric) => fabric.yards))
    for (const row of rows) expect(row.yardsText).toBe(formatYards(row.yards))
    // A role key is never shown where the colourway names the fabric.
    for (const row of rows) if (first!.fabrics[row.fabric]) expect(row.name).not.toBe(row.fabric)

    // A narrower width of fabric: more strips, so more yards (recomputed in the browser at once).
    await page.getByLabel(/Usable width of fabric/).fill('20')
    const narrow = fabricRequirements(design, plan, first!, { widthOfFabricIn: 20 })
    await expect.poll(async () => (await tableRows(page)).map((row) => row.yards)).toEqual(narrow.fabrics.map((fabric) => fabric.yards))
    const yardsAt = (list: { yards: number }[]) => list.reduce((sum, row) => sum + row.yards, 0)
    expect(yardsAt(await tableRows(page))).toBeGreaterThan(yardsAt(rows))
    await page.getByLabel(/Usable width of fabric/).fill('40')
    await expect.poll(async () => (await tableRows(page)).map((row) => row.yards)).toEqual(expected.fabrics.map((fabric) => fabric.yards))

    // Another colourway: the same fabrics under its names.
    await page.getByLabel('Colourway').selectOption(second!.name)
    const other = fabricRequirements(design, plan, second!)
    await expect.poll(async () => (await tableRows(page)).map((row) => row.name)).toEqual(other.fabrics.map((fabric) => fabric.name))
    expect(other.fabrics.map((fabric) => fabric.name)).not.toEqual(expected.fabrics.map((fabric) => fabric.name))
    await expect.poll(() => page.getByTestId('fabric-table').locator('caption').textContent()).toContain(second!.name)

    // One cutting diagram per fabric, one rect per cut of its layout, each labelled by what it is for.
    const diagrams = page.getByTestId('cutting-diagram')
    expect(await diagrams.count()).toBe(other.fabrics.length)
    for (const fabric of other.fabrics) {
      const diagram = page.locator(`[data-testid="cutting-diagram"][data-fabric="${fabric.fabric}"]`)
      const cuts = await diagram.locator('rect[data-cut]').evaluateAll((rects) => rects.map((rect) => rect.getAttribute('data-cut')))
      expect(cuts).toEqual(fabric.cuts.map((cut) => cut.for))
      // Accessible: the picture has a title, and the strips are listed in words beside it.
      expect(await diagram.locator('svg > title').textContent()).toContain(fabric.name)
      expect(await diagram.locator('ol > li').count()).toBe(fabric.strips.length)
    }

    // The leaf preparation list: two pieces per folded leaf (common practice).
    for (const leaf of other.leaves) {
      await expect.poll(() => page.locator(`[data-testid="leaf-preparation"] > li[data-fabric="${leaf.fabric}"]`).textContent()).toContain(`${leaf.leaves} folded leaves, ${2 * leaf.leaves} pieces`)
    }

    // Sorted by yards, most first, then exported: the CSV parses back to the rows shown, in their order.
    await page.getByRole('button', { name: 'Yards' }).click()
    await page.getByRole('button', { name: 'Yards' }).click()
    expect(await page.getByRole('columnheader', { name: 'Yards' }).getAttribute('aria-sort')).toBe('descending')
    const shown = await tableRows(page)
    expect(shown.map((row) => row.yards)).toEqual([...shown.map((row) => row.yards)].sort((a, b) => b - a))
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Download CSV' }).click()
    const file = await download
    expect(file.suggestedFilename()).toBe('hollyberry-wreath-cider-orchard-fabric.csv')
    const csv = Papa.parse<string[]>(fs.readFileSync(await file.path(), 'utf8'), { skipEmptyLines: true })
    expect(csv.errors).toEqual([])
    const [header, ...data] = csv.data
    expect(header).toEqual([...CSV_FIELDS])
    expect(data.map((row) => [row[0], row[1], Number(row[3]), Number(row[4])])).toEqual(shown.map((row) => [second!.name, row.name, row.pieces, row.yards]))

    expect(pageErrors).toEqual([])
    await context.close()
  })
})
