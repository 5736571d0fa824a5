import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { boardDesign, clickAt, createPatternFromPage, designerAtTheBoard, dragSeam, screenPointOf } from '../support/board'
import { baseUrl } from '../support/browser'

let browser: Browser
let page: Page
let pageErrors: string[]

beforeAll(async () => {
  ;({ browser, page, pageErrors } = await designerAtTheBoard())
})
afterAll(async () => {
  await browser?.close()
})

const cos60 = Math.cos(Math.PI / 3)
const sin60 = Math.sin(Math.PI / 3)

async function setNumber(label: string, value: number) {
  const input = page.getByLabel(label, { exact: true })
  await input.fill(String(value))
  await input.press('Enter')
}

const planStatus = () => page.getByTestId('plan-status').innerText()
const stepsList = () => page.getByRole('list', { name: 'Steps by section' }).innerText()

describe('a designer drafts a ring on the board', () => {
  it('sets the ring, draws seams with the mouse, meets a set-in seam, places a leaf and fills, and finds it all after a reload', async () => {
    const id = await createPatternFromPage(page, `Lantern board ${Date.now()}`)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()

    // A 20 in ring of sixths meeting at the centre.
    await setNumber('Outer radius', 10)
    await setNumber('Repeats', 6)
    await expect.poll(() => page.getByTestId('finished-diameter').innerText()).toBe('20 in')
    await page.getByRole('button', { name: 'Fit' }).click()

    // Three seams: two chords across the sixth, and a radial seam from the outer chord's middle to the arc.
    await page.keyboard.press('s')
    await dragSeam(page, [5, 0], [5 * cos60, 5 * sin60])
    await dragSeam(page, [8, 0], [8 * cos60, 8 * sin60])
    await dragSeam(page, [6, 8 * sin60 / 2], [10 * Math.cos(Math.PI / 6), 10 * Math.sin(Math.PI / 6)])
    expect((await boardDesign(page)).seams).toHaveLength(3)
    await expect.poll(planStatus).toBe('Sewable: 4 areas in 1 section.')
    for (const label of ['A1', 'A2', 'A3', 'A4']) expect(await stepsList()).toContain(label)

    // Three seams meeting at one point inside the centre area, none continuing another: a Y.
    const y: [number, number] = [2, 1.2]
    await dragSeam(page, [3, 0], y)
    await dragSeam(page, y, [1.6 * cos60, 1.6 * sin60])
    await dragSeam(page, y, [3.75, 2.5 * sin60])
    await expect.poll(() => page.getByTestId('problems').innerText()).toContain('set-in (Y) seam')
    await expect.poll(() => page.getByTestId('plan-status').getAttribute('data-sewable')).toBe('false')
    // Pointing at the marker on the board shows that problem's message there.
    await page.mouse.move(...(await screenPointOf(page, y)))
    await expect.poll(() => page.evaluate(() => window.wreathwrightBoard!.getState().shownProblem)).not.toBeNull()

    // Undo the three seams of the Y.
    for (let i = 0; i < 3; i += 1) await page.keyboard.press('Control+z')
    await expect.poll(planStatus).toBe('Sewable: 4 areas in 1 section.')
    expect((await boardDesign(page)).seams).toHaveLength(3)

    // A leaf on the outer chord, lying over the outer area (so the outer areas are sewn first).
    await page.keyboard.press('l')
    await clickAt(page, [7.2, 1.5])
    await page.getByTestId('leaf-editor').waitFor()
    const leaves = (await boardDesign(page)).leaves
    expect(leaves).toHaveLength(1)
    expect(leaves[0]).toMatchObject({ seam: 's2', side: 'right' })
    await expect.poll(planStatus).toBe('Sewable: 4 areas in 1 section.')

    // A second layer on top, turned and sized in the inspector so the layer beneath shows.
    await page.getByRole('button', { name: 'Add a layer on top' }).click()
    await expect.poll(async () => (await boardDesign(page)).leaves[0]?.layers.length).toBe(2)
    for (const [id, value] of [['#leaf-layer-1-turn', -15], ['#leaf-layer-1-size', 80]] as const) {
      await page.locator(id).fill(String(value))
      await page.locator(id).press('Enter')
    }
    await expect.poll(async () => (await boardDesign(page)).leaves[0]?.layerOffsets).toEqual([{}, { turn: -15, scale: 0.8 }])

    // Spreading the leaf colours with one leaf per repeat: each leaf sits beside its own copies,
    // and the fabric panel says why nothing could alternate; the leaf keeps its layers.
    const leafBeforeSpread = (await boardDesign(page)).leaves[0]
    await page.getByRole('button', { name: 'Spread the leaf colours' }).click()
    await expect.poll(() => page.getByRole('status', { name: 'Leaf colours' }).innerText()).toMatch(/one leaf in each repeat|one fabric/)
    expect((await boardDesign(page)).leaves[0]).toEqual(leafBeforeSpread)

    // Fill two areas: the centre with the background, the band with a new fabric role (named in
    // words; its key is derived: "Band" → band).
    await page.getByRole('button', { name: 'Fill with Background' }).click()
    await clickAt(page, [2, 1])
    await page.getByLabel('New fabric role').fill('Band')
    await page.getByRole('button', { name: 'Add', exact: true }).click()
    await page.keyboard.press('f')
    await clickAt(page, [5.5, 2])
    expect((await boardDesign(page)).fills).toEqual([
      { at: expect.any(Array), fabric: 'background' },
      { at: expect.any(Array), fabric: 'band' },
    ])

    // Colourways: duplicate the one shown and rename a fabric of the copy; the first keeps its
    // names, the copy is shown, and its swatch reads the new name, never the role.
    await page.getByRole('button', { name: 'Duplicate', exact: true }).click()
    await expect.poll(async () => (await boardDesign(page)).colorways.map((c: { name: string }) => c.name)).toEqual(['Main', 'Main copy'])
    expect(await page.locator('#colorway').inputValue()).toBe('Main copy')
    const backgroundName = page.getByLabel('Name of the background fabric in Main copy')
    await backgroundName.fill('Oatmeal linen-look')
    await backgroundName.press('Enter')
    await expect
      .poll(async () => (await boardDesign(page)).colorways.map((c: { fabrics: Record<string, { name: string }> }) => c.fabrics.background?.name))
      .toEqual(['Background', 'Oatmeal linen-look'])
    await page.getByRole('button', { name: 'Fill with Oatmeal linen-look' }).waitFor()

    // The printed side: the mirror image as it goes on the paper.
    await page.getByRole('button', { name: 'Printed side' }).click()
    expect(await page.getByRole('button', { name: 'Printed side' }).getAttribute('aria-pressed')).toBe('true')

    // Saved by itself; after a reload everything is as it was.
    await expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')
    const before = await boardDesign(page)
    await page.reload()
    await page.getByTestId('plan-panel').waitFor()
    const after = await boardDesign(page)
    expect(after.ring).toEqual({ innerRadius: 0, outerRadius: 10, repeats: 6, repeatMode: 'rotate' })
    expect(after.seams).toEqual(before.seams)
    expect(after.leaves).toEqual(before.leaves)
    expect(after.fills).toEqual(before.fills)
    expect(after.colorways).toEqual(before.colorways)
    await expect.poll(planStatus).toBe('Sewable: 4 areas in 1 section.')
    // The board opens on the side it was left on.
    expect(await page.getByRole('button', { name: 'Printed side' }).getAttribute('aria-pressed')).toBe('true')
  })

  it('checks an order set by hand at once and says which step fails', async () => {
    const sixth = (degrees: number, radius: number): [number, number] => [radius * Math.cos((degrees * Math.PI) / 180), radius * Math.sin((degrees * Math.PI) / 180)]
    const design = {
      format: 'wreathwright-design',
      version: 1,
      name: 'Hand order',
      units: 'in',
      ring: { innerRadius: 0, outerRadius: 10, repeats: 6, repeatMode: 'rotate' },
      seams: [
        { id: 'chord', from: [5, 0], to: sixth(60, 5) },
        { id: 'band', from: [8, 0], to: sixth(60, 8) },
        { id: 'divide', from: sixth(30, 8 * Math.cos(Math.PI / 6)), to: sixth(30, 10) },
      ],
    }
    const id = await page.evaluate(async (body) => {
      const response = await fetch('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) })
      return ((await response.json()) as { pattern: { id: string } }).pattern.id
    }, { name: `Hand order ${Date.now()}`, design })
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()
    const centre: [number, number] = [2, 1]
    const band: [number, number] = [5.5, 2]
    const outerLow: [number, number] = [8.5, 1.5]
    const outerHigh: [number, number] = [5, 7.5]

    // Centre outwards cannot work: the last outer area meets the sewn ones along two seams.
    await page.getByRole('button', { name: 'Set the order by hand' }).click()
    for (const point of [centre, band, outerLow, outerHigh]) await clickAt(page, point)
    await page.getByRole('button', { name: 'Check this order' }).click()
    await expect.poll(() => page.getByTestId('plan-status').getAttribute('data-sewable')).toBe('false')
    await expect.poll(() => page.getByTestId('problems').innerText()).toMatch(/A4 meets the sewn areas along two lines/)

    // Outside in, it is one foundation, in the designer's own order.
    await page.getByRole('button', { name: 'Go back to the proposed order' }).click()
    await page.getByRole('button', { name: 'Set the order by hand' }).click()
    for (const point of [outerHigh, outerLow, band, centre]) await clickAt(page, point)
    await page.getByRole('button', { name: 'Check this order' }).click()
    await expect.poll(planStatus).toBe('Sewable: 4 areas in 1 section (your order).')
  })

  it('threw no errors in the page', () => {
    expect(pageErrors).toEqual([])
  })
})
