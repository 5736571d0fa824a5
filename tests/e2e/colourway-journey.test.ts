/**
 * A designer's colourway from start to shop list, in Chromium: duplicate a colourway, rename its
 * fabrics, take two colours from a theme-fabric photo (a made-up striped PNG, never a real photo),
 * then see the fabric table and the cutting diagrams follow, and export the table as CSV.
 */
import fs from 'node:fs'
import Papa from 'papaparse'
import type { Browser } from 'playwright-core'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { fabricRequirements, planDesign } from '@/geometry'
import { parseDesign } from '@/lib/schemas/design'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { boardDesign, createPatternFromPage } from '../support/board'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

const STRIPES = ['#7b2d26', '#e8dcc4', '#2f5d50', '#d9a441']

async function stripesPng(): Promise<Buffer> {
  const tiles = await Promise.all(
    STRIPES.map(async (colour, i) => ({ input: await sharp({ create: { width: 40, height: 120, channels: 3, background: colour } }).png().toBuffer(), left: i * 40, top: 0 })),
  )
  return sharp({ create: { width: 40 * STRIPES.length, height: 120, channels: 3, background: '#000000' } }).composite(tiles).png().toBuffer()
}

/** A quarter ring with a band: two fabrics, so the table and the diagrams have something to show. */
const bandedRing = (name: string) => ({
  format: 'wreathwright-design',
  version: 2,
  name,
  units: 'in',
  ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' },
  seams: [{ id: 's1', from: [6, 0], to: [0, 6] }],
  fills: [
    { at: [1, 1], fabric: 'background' },
    { at: [6, 6], fabric: 'band' },
  ],
  leaves: [],
  stems: [],
  berries: [],
  curls: [],
  colorways: [{ name: 'Main', fabrics: { background: { name: 'Background', color: '#f4ecd8' }, band: { name: 'Band', color: '#8a3b12' } } }],
  order: null,
})

describe('a colourway from the board to the fabric page', () => {
  it('duplicates a colourway, renames its fabrics, takes two photo colours, and the table, diagrams and CSV follow', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'tomasz@juniperthread.example', DEMO_PASSWORD)
    const name = `Journey ${Date.now()}`
    const id = await createPatternFromPage(page, name, bandedRing(name))

    // On the board: a copy of the colourway, its two fabrics renamed.
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()
    await page.getByRole('button', { name: 'Duplicate', exact: true }).click()
    await expect.poll(async () => (await boardDesign(page)).colorways.map((c: { name: string }) => c.name)).toEqual(['Main', 'Main copy'])
    for (const [role, fabricName] of [['background', 'Oatmeal linen-look'], ['band', 'Rosehip sateen']] as const) {
      const field = page.getByLabel(`Name of the ${role} fabric in Main copy`)
      await field.fill(fabricName)
      await field.press('Enter')
    }
    await expect
      .poll(async () => (await boardDesign(page)).colorways[1]?.fabrics)
      .toMatchObject({ background: { name: 'Oatmeal linen-look' }, band: { name: 'Rosehip sateen' } })

    // A theme-fabric photo: two of its colours become the copy's fabric colours.
    const panel = page.getByTestId('theme-photo')
    await panel.getByLabel('Theme fabric photo (JPEG, PNG or WebP, up to 10 MB)').setInputFiles({ name: 'theme.png', mimeType: 'image/png', buffer: await stripesPng() })
    await expect.poll(() => panel.getByRole('list', { name: 'Colours of the theme fabric' }).getByRole('button').count()).toBe(STRIPES.length)
    for (const [colour, fabricName] of [['#2f5d50', 'Oatmeal linen-look'], ['#d9a441', 'Rosehip sateen']] as const) {
      await panel.getByRole('button', { name: `Palette colour ${colour}` }).click()
      await panel.getByRole('group', { name: `Use ${colour} for a fabric` }).getByRole('button', { name: fabricName }).click()
    }
    await expect
      .poll(async () => (await boardDesign(page)).colorways[1]?.fabrics)
      .toMatchObject({ background: { color: '#2f5d50' }, band: { color: '#d9a441' } })
    // The first colourway is untouched, and the photo is the copy's alone.
    expect((await boardDesign(page)).colorways[0]?.fabrics).toMatchObject({ background: { name: 'Background', color: '#f4ecd8' }, band: { name: 'Band', color: '#8a3b12' } })
    expect((await boardDesign(page)).colorways.map((c: { themePhoto?: string }) => c.themePhoto !== undefined)).toEqual([false, true])
    await expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')

    // The fabric page of the saved design, checked against the core's own requirements.
    await page.goto(`${baseUrl()}/patterns/${id}/fabric`)
    await page.getByTestId('fabric-table').waitFor()
    const saved = await page.evaluate(async (patternId) => (await fetch(`/api/patterns/${patternId}`)).json(), id)
    const parsed = parseDesign(saved.pattern.design)
    if (!parsed.ok) throw new Error('the saved design does not parse')
    const plan = planDesign(parsed.design)
    const [main, copy] = parsed.design.colorways
    const expected = fabricRequirements(parsed.design, plan, copy!)

    const rowNames = () => page.getByTestId('fabric-table').locator('tbody tr th').allTextContents()
    expect(await rowNames()).toEqual(fabricRequirements(parsed.design, plan, main!).fabrics.map((fabric) => fabric.name))
    await page.getByLabel('Colourway').selectOption('Main copy')
    await expect.poll(rowNames).toEqual(expected.fabrics.map((fabric) => fabric.name))
    // The two renamed fabrics (and the binding, which the ring's edge always needs).
    expect(await rowNames()).toEqual(expect.arrayContaining(['Oatmeal linen-look', 'Rosehip sateen']))
    expect(await rowNames()).not.toContain('Background')
    await expect.poll(() => page.getByRole('img', { name: 'Oatmeal linen-look: colour #2f5d50' }).count()).toBe(1)
    // The cutting diagrams now carry the copy's names, one rect per cut.
    for (const fabric of expected.fabrics) {
      const diagram = page.locator(`[data-testid="cutting-diagram"][data-fabric="${fabric.fabric}"]`)
      await expect.poll(() => diagram.locator('svg > title').textContent()).toContain(fabric.name)
      expect(await diagram.locator('rect[data-cut]').count()).toBe(fabric.cuts.length)
    }

    // The CSV: the copy's fabrics by name.
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: 'Download CSV' }).click()
    const csv = Papa.parse<string[]>(fs.readFileSync(await (await download).path(), 'utf8'), { skipEmptyLines: true })
    expect(csv.errors).toEqual([])
    expect(csv.data.slice(1).map((row) => [row[0], row[1]])).toEqual(expected.fabrics.map((fabric) => ['Main copy', fabric.name]))

    expect(pageErrors).toEqual([])
    await context.close()
  })
})
