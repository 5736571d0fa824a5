/**
 * The fabric panel's theme-fabric photo in Chromium: a made-up striped PNG (never a real photo) is
 * uploaded through the page's file input to the app and the object store the test run started, its
 * palette appears as swatches, and one click on a swatch and one on a fabric colours that fabric.
 */
import type { Browser, Page } from 'playwright-core'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { boardDesign, createPatternFromPage } from '../support/board'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

let browser: Browser
let page: Page
const pageErrors: string[] = []

beforeAll(async () => {
  browser = await launchBrowser()
  page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage()
  page.on('pageerror', (error) => pageErrors.push(String(error)))
  await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
})
afterAll(async () => {
  await browser?.close()
})

const STRIPES = ['#7b2d26', '#e8dcc4', '#2f5d50', '#d9a441', '#3b4f7a', '#a35d8c']

async function stripesPng(): Promise<Buffer> {
  const tiles = await Promise.all(
    STRIPES.map(async (colour, i) => ({ input: await sharp({ create: { width: 40, height: 120, channels: 3, background: colour } }).png().toBuffer(), left: i * 40, top: 0 })),
  )
  return sharp({ create: { width: 40 * STRIPES.length, height: 120, channels: 3, background: '#000000' } }).composite(tiles).png().toBuffer()
}

describe('a theme-fabric photo on the drafting board', () => {
  it('explains a refused file, then proposes the colours of a photo and gives one to a fabric', async () => {
    const id = await createPatternFromPage(page, `Theme photo ${Date.now()}`)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    const panel = page.getByTestId('theme-photo')
    await panel.waitFor()
    const input = page.getByLabel('Theme fabric photo (JPEG, PNG or WebP, up to 10 MB)')

    // A text file named like a photo: refused in plain words, nothing shown.
    await input.setInputFiles({ name: 'fabric.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('not a photo at all\n') })
    await expect.poll(() => panel.getByRole('alert').innerText()).toContain('its contents are not a JPEG, PNG or WebP image')
    expect(await panel.getByRole('img', { name: 'Theme fabric' }).count()).toBe(0)

    await input.setInputFiles({ name: 'fabric.png', mimeType: 'image/png', buffer: await stripesPng() })
    const swatches = panel.getByRole('list', { name: 'Colours of the theme fabric' }).getByRole('button')
    await expect.poll(() => swatches.count()).toBe(STRIPES.length)
    expect(await panel.getByRole('alert').count()).toBe(0)
    // The photo is served to its owner and shown.
    await expect.poll(() => panel.getByRole('img', { name: 'Theme fabric' }).evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(240)

    const labels = await swatches.evaluateAll((buttons) => buttons.map((button) => button.getAttribute('aria-label')))
    const colours = labels.map((label) => label!.replace('Palette colour ', ''))
    expect([...colours].sort()).toEqual([...STRIPES].sort())

    const green = '#2f5d50'
    await panel.getByRole('button', { name: `Palette colour ${green}` }).click()
    await panel.getByRole('group', { name: `Use ${green} for a fabric` }).getByRole('button', { name: 'Background' }).click()
    await expect.poll(async () => (await boardDesign(page)).colorways[0]?.fabrics.background?.color).toBe(green)
    expect(await panel.getByRole('status').innerText()).toBe(`Background is now ${green} in Main.`)

    // One undoable step.
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
    await page.keyboard.press('Control+z')
    await expect.poll(async () => (await boardDesign(page)).colorways[0]?.fabrics.background?.color).toBe('#f4ecd8')

    // The latest photo and its palette are there again when the board opens.
    await page.reload()
    await expect.poll(() => page.getByTestId('theme-photo').getByRole('list', { name: 'Colours of the theme fabric' }).getByRole('button').count()).toBe(STRIPES.length)
    expect(pageErrors).toEqual([])
  })
})
