/**
 * The fabric panel's theme-fabric photo in Chromium: made-up striped PNGs (never real photos) are
 * uploaded through the page's file input to the app and the object store the test run started,
 * the palette appears as swatches, and one click on a swatch and one on a fabric colours that
 * fabric. The photo belongs to the colourway shown: another colourway shows its own or none, a
 * duplicate keeps it, another pattern never shows it, and undo takes it back.
 */
import type { Browser, Page } from 'playwright-core'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
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
const OTHER_STRIPES = ['#1d3557', '#f1c453', '#e76f51', '#6a994e']
const UPLOAD_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/

async function stripesPng(colours: readonly string[]): Promise<Buffer> {
  const tiles = await Promise.all(
    colours.map(async (colour, i) => ({ input: await sharp({ create: { width: 40, height: 120, channels: 3, background: colour } }).png().toBuffer(), left: i * 40, top: 0 })),
  )
  return sharp({ create: { width: 40 * colours.length, height: 120, channels: 3, background: '#000000' } }).composite(tiles).png().toBuffer()
}

const panel = () => page.getByTestId('theme-photo')
const photoInput = () => page.getByLabel('Theme fabric photo (JPEG, PNG or WebP, up to 10 MB)')
/** The palette shown beside the photo, sorted. */
const shownPalette = async () =>
  (await panel().getByRole('list', { name: 'Colours of the theme fabric' }).getByRole('button').evaluateAll((buttons) => buttons.map((b) => b.getAttribute('aria-label')!.replace('Palette colour ', '')))).sort()
/** The upload id of the photo shown, or null for none. */
const shownPhoto = () => panel().getAttribute('data-photo')
const themePhotos = async () => (await boardDesign(page)).colorways.map((c: { themePhoto?: string }) => c.themePhoto ?? null)
const colorwayAction = (name: string) => page.getByRole('group', { name: 'Colourway actions' }).getByRole('button', { name, exact: true })
const chooseColorway = (name: string) => page.getByLabel('Colourway', { exact: true }).selectOption(name)
const undo = async () => {
  await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
  await page.keyboard.press('Control+z')
}
const saved = () => expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')

describe('a theme-fabric photo on the drafting board', () => {
  it('explains a refused file, then proposes the colours of a photo and gives one to a fabric', async () => {
    const id = await createPatternFromPage(page, `Theme photo ${Date.now()}`)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await panel().waitFor()

    // A text file named like a photo: refused in plain words, nothing shown, nothing set.
    await photoInput().setInputFiles({ name: 'fabric.jpg', mimeType: 'image/jpeg', buffer: Buffer.from('not a photo at all\n') })
    await expect.poll(() => panel().getByRole('alert').innerText()).toContain('its contents are not a JPEG, PNG or WebP image')
    expect(await panel().getByRole('img').count()).toBe(0)
    expect(await themePhotos()).toEqual([null])

    await photoInput().setInputFiles({ name: 'fabric.png', mimeType: 'image/png', buffer: await stripesPng(STRIPES) })
    await expect.poll(shownPalette).toEqual([...STRIPES].sort())
    expect(await panel().getByRole('alert').count()).toBe(0)
    // The photo is the colourway's now, by its upload id, served to its owner and shown.
    const [photo] = await themePhotos()
    expect(photo).toMatch(UPLOAD_ID)
    expect(await shownPhoto()).toBe(photo)
    await expect.poll(() => panel().getByRole('img', { name: 'Theme fabric of Main' }).evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(240)

    const green = '#2f5d50'
    await panel().getByRole('button', { name: `Palette colour ${green}` }).click()
    await panel().getByRole('group', { name: `Use ${green} for a fabric` }).getByRole('button', { name: 'Background' }).click()
    await expect.poll(async () => (await boardDesign(page)).colorways[0]?.fabrics.background?.color).toBe(green)
    expect(await panel().getByRole('status').innerText()).toBe(`Background is now ${green} in Main.`)

    // One undoable step; the photo stays.
    await undo()
    await expect.poll(async () => (await boardDesign(page)).colorways[0]?.fabrics.background?.color).toBe('#f4ecd8')
    expect(await themePhotos()).toEqual([photo])

    // Saved with the design: the photo and its palette are there again when the board opens.
    await saved()
    await page.reload()
    await expect.poll(shownPalette).toEqual([...STRIPES].sort())
    expect(await shownPhoto()).toBe(photo)
    expect(pageErrors).toEqual([])
  })

  it('keeps each colourway to its own photo, a duplicate keeping it, and shows none on another pattern', async () => {
    const id = await createPatternFromPage(page, `Theme photos per colourway ${Date.now()}`)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await panel().waitFor()
    await photoInput().setInputFiles({ name: 'first.png', mimeType: 'image/png', buffer: await stripesPng(STRIPES) })
    await expect.poll(shownPalette).toEqual([...STRIPES].sort())
    const [first] = await themePhotos()

    // A duplicate starts from the same theme fabric.
    await colorwayAction('Duplicate').click()
    await expect.poll(themePhotos).toEqual([first, first])
    expect(await page.getByLabel('Colourway', { exact: true }).inputValue()).toBe('Main copy')
    await expect.poll(shownPhoto).toBe(first)

    // Another photo for the copy only.
    await photoInput().setInputFiles({ name: 'second.png', mimeType: 'image/png', buffer: await stripesPng(OTHER_STRIPES) })
    await expect.poll(shownPalette).toEqual([...OTHER_STRIPES].sort())
    const [, second] = await themePhotos()
    expect(second).toMatch(UPLOAD_ID)
    expect(second).not.toBe(first)
    await expect.poll(() => panel().getByRole('img', { name: 'Theme fabric of Main copy' }).evaluate((img: HTMLImageElement) => img.naturalWidth)).toBe(160)

    // Switching colourways shows each one's photo and palette.
    await chooseColorway('Main')
    await expect.poll(shownPhoto).toBe(first)
    await expect.poll(shownPalette).toEqual([...STRIPES].sort())
    // A new colourway starts from no photo.
    await colorwayAction('New').click()
    await expect.poll(() => page.getByLabel('Colourway', { exact: true }).inputValue()).toBe('Colourway 3')
    await expect.poll(shownPhoto).toBe(null)
    expect(await panel().getByRole('img').count()).toBe(0)
    expect(await panel().getByRole('button', { name: 'Upload a photo' }).count()).toBe(1)
    await chooseColorway('Main copy')
    await expect.poll(shownPalette).toEqual([...OTHER_STRIPES].sort())

    // Undo steps back through the colourway made, then the copy's own photo: the copy shows the first again.
    await undo()
    await undo()
    await expect.poll(themePhotos).toEqual([first, first])
    await expect.poll(shownPalette).toEqual([...STRIPES].sort())
    // Removed, one step, and redone.
    await panel().getByRole('button', { name: 'Remove photo' }).click()
    await expect.poll(themePhotos).toEqual([first, null])
    await expect.poll(shownPhoto).toBe(null)
    await undo()
    await expect.poll(shownPhoto).toBe(first)
    await saved()

    // Another pattern of the same designer: not shown.
    const other = await createPatternFromPage(page, `No theme photo ${Date.now()}`)
    await page.goto(`${baseUrl()}/patterns/${other}/board`)
    await panel().waitFor()
    expect(await shownPhoto()).toBe(null)
    expect(await panel().getByRole('img').count()).toBe(0)
    // Unless the designer picks one of her earlier photos for it: newest first, no upload again.
    await panel().getByText('Your earlier photos').click()
    const earlier = panel().getByRole('list', { name: 'Your earlier theme photos' }).getByRole('button')
    await expect.poll(() => earlier.first().getAttribute('data-upload')).toBe(second)
    await earlier.first().click()
    await expect.poll(themePhotos).toEqual([second])
    await expect.poll(shownPalette).toEqual([...OTHER_STRIPES].sort())
    expect(pageErrors).toEqual([])
  })

  it('shows nothing, and no error, for a photo that can no longer be read', async () => {
    // A design naming an upload that does not exist (deleted, or someone else's in an imported file).
    const missing = '00000000-0000-4000-8000-000000000000'
    const name = `Lost theme photo ${Date.now()}`
    const design = { ...emptyDesign(name), colorways: [{ name: 'Main', fabrics: { background: { name: 'Background', color: '#f4ecd8' } }, themePhoto: missing }] }
    const id = await createPatternFromPage(page, name, design)
    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await panel().waitFor()
    expect(await themePhotos()).toEqual([missing])
    await expect.poll(() => panel().getByRole('button', { name: 'Upload a photo' }).count()).toBe(1)
    expect(await shownPhoto()).toBe(null)
    expect(await panel().getByRole('alert').count()).toBe(0)
    expect(pageErrors).toEqual([])
  })
})
