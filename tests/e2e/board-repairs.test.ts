import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { boardDesign, createPatternFromPage, designerAtTheBoard } from '../support/board'
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

/**
 * A quarter ring 18 in across with a Y: three seams meet at (3, 3), none continuing another, so
 * the centre cannot be pieced without a set-in seam. A leaf lies on s3.
 */
const Y_SEAMS = [
  { id: 's1', from: [3, 3], to: [6, 0] },
  { id: 's2', from: [3, 3], to: [0, 4] },
  { id: 's3', from: [3, 3], to: [6.364, 6.364] },
]
const yJunction = {
  ...emptyDesign('Y junction'),
  seams: Y_SEAMS,
  leaves: [{ id: 'l1', seam: 's3', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['background'] }],
}

const sewable = () => page.getByTestId('plan-status').getAttribute('data-sewable')
/** How many ghost lines the board's canvas holds (named by components/board/repair-ghost-shapes.tsx). */
const ghostLines = () => page.evaluate(() => window.wreathwrightStage?.find('.repair-ghost').length ?? -1)

describe('a designer mends a set-in seam with a suggested repair', () => {
  it('sees a suggestion beside the problem, its ghost on the ring, applies it in one step and undoes it', async () => {
    const id = await createPatternFromPage(page, `Y repair ${Date.now()}`, yJunction)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()
    await expect.poll(sewable).toBe('false')
    expect(await page.getByTestId('problems').innerText()).toContain('set-in (Y) seam')

    // The suggestions come once the board is still; each says what it does and how it sews.
    const first = page.getByTestId('repair-suggestion').first()
    await first.waitFor({ timeout: 15_000 })
    expect(await page.getByTestId('repair-suggestions').innerText()).toContain('Changes that would make it sewable')
    expect(await first.innerText()).toMatch(/sews in \d+ sections?/)

    // Pointing at it draws the ghost over every repeat; the design is untouched.
    expect(await ghostLines()).toBe(0)
    await first.hover()
    await expect.poll(() => first.getAttribute('data-shown')).toBe('true')
    await expect.poll(ghostLines).toBeGreaterThanOrEqual(4)
    expect((await boardDesign(page)).seams).toEqual(Y_SEAMS)
    // Moving away takes the ghost off; tabbing to it (keyboard focus) brings it back.
    await page.getByTestId('plan-status').hover()
    await expect.poll(ghostLines).toBe(0)
    await first.focus()
    await expect.poll(ghostLines).toBeGreaterThanOrEqual(4)

    // Choosing it: one step, the plan sewable at once, ids kept, the leaf on its seam.
    const pastBefore = await page.evaluate(() => window.wreathwrightBoard!.getState().history.past.length)
    await first.click()
    await expect.poll(sewable).toBe('true')
    const repaired = await boardDesign(page)
    expect(repaired.seams.map((seam: { id: string }) => seam.id)).toEqual(expect.arrayContaining(['s1', 's2', 's3']))
    expect(repaired.seams).not.toEqual(Y_SEAMS)
    expect(repaired.leaves).toEqual(yJunction.leaves)
    expect(await page.evaluate(() => window.wreathwrightBoard!.getState().history.past.length)).toBe(pastBefore + 1)
    expect(await ghostLines()).toBe(0)
    // Saved like any other change.
    await expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')

    // Undo gives the seams back exactly, and the problem with them.
    await page.getByTestId('board-canvas').focus()
    await page.keyboard.press('Control+z')
    await expect.poll(sewable).toBe('false')
    expect((await boardDesign(page)).seams).toEqual(Y_SEAMS)
    await expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')
  })

  it('threw no errors in the page', () => {
    expect(pageErrors).toEqual([])
  })
})
