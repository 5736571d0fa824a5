/**
 * Swatch images in Chromium: a designer uploads a swatch image (a made-up checked PNG, never a
 * real photo) for one fabric of a colourway on the board, removes it and takes it back with undo,
 * and sees it on the fabric page, in the fabric table and beside that fabric's cutting diagram.
 * The image stays the designer's: another designer cannot read it.
 */
import type { Browser } from 'playwright-core'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
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

const UPLOAD_ID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/

/** A 48 × 48 px check of two colours, as a swatch photo might look. */
async function checkPng(): Promise<Buffer> {
  const square = await sharp({ create: { width: 24, height: 24, channels: 3, background: '#8a3b12' } }).png().toBuffer()
  return sharp({ create: { width: 48, height: 48, channels: 3, background: '#f4ecd8' } })
    .composite([{ input: square, left: 0, top: 0 }, { input: square, left: 24, top: 24 }])
    .png()
    .toBuffer()
}

/** A quarter ring with a band: two fabrics, each with pieces to cut. */
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
  colorways: [{ name: 'Main', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' }, band: { name: 'Rust check', color: '#8a3b12' } } }],
  order: null,
})

describe('swatch images', () => {
  it('a designer uploads a swatch image for a fabric on the board and sees it in the fabric table and the cutting diagram', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } })
    const page = await context.newPage()
    const pageErrors: string[] = []
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(page, 'tomasz@juniperthread.example', DEMO_PASSWORD)
    const name = `Swatches ${Date.now()}`
    const id = await createPatternFromPage(page, name, bandedRing(name))

    await page.goto(`${baseUrl()}/patterns/${id}/board`)
    await page.getByTestId('plan-panel').waitFor()
    const swatchOf = async (role: string): Promise<string | null> => (await boardDesign(page)).colorways[0]?.fabrics[role]?.swatch ?? null
    const row = page.getByRole('list', { name: 'Fabric swatches' }).locator('li[data-fabric="band"]')

    // A file that is not an image: refused in plain words, nothing set.
    await page.getByLabel('Swatch image of Rust check (JPEG, PNG or WebP, up to 10 MB)').setInputFiles({ name: 'rust.png', mimeType: 'image/png', buffer: Buffer.from('no picture here\n') })
    await expect.poll(() => page.getByRole('alert').filter({ hasText: 'Rust check:' }).innerText()).toContain('not a JPEG, PNG or WebP image')
    expect(await swatchOf('band')).toBe(null)

    await page.getByLabel('Swatch image of Rust check (JPEG, PNG or WebP, up to 10 MB)').setInputFiles({ name: 'rust.png', mimeType: 'image/png', buffer: await checkPng() })
    await expect.poll(() => swatchOf('band')).toMatch(UPLOAD_ID)
    const swatch = (await swatchOf('band'))!
    expect(await swatchOf('background')).toBe(null)
    // The board's chip shows the image over the fabric's colour.
    expect(await row.getByRole('button', { name: 'Fill with Rust check' }).evaluate((chip) => (chip as HTMLElement).style.backgroundImage)).toBe(`url("/api/uploads/${swatch}")`)

    // Removed, then back with undo: one step each.
    await row.getByRole('button', { name: 'Remove the swatch image of Rust check' }).click()
    await expect.poll(() => swatchOf('band')).toBe(null)
    await page.evaluate(() => (document.activeElement as HTMLElement | null)?.blur())
    await page.keyboard.press('Control+z')
    await expect.poll(() => swatchOf('band')).toBe(swatch)
    await expect.poll(() => page.getByTestId('save-status').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')

    // The fabric page of the saved design: the image beside the colour in the table and by the diagram.
    await page.goto(`${baseUrl()}/patterns/${id}/fabric`)
    const table = page.getByTestId('fabric-table')
    await table.waitFor()
    const tableImage = table.locator('tr[data-fabric="band"]').getByRole('img', { name: 'Rust check: swatch image' })
    await expect.poll(() => tableImage.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(48)
    expect(await tableImage.getAttribute('src')).toBe(`/api/uploads/${swatch}`)
    expect(await table.locator('tr[data-fabric="band"]').getByRole('img', { name: 'Rust check: colour #8a3b12' }).count()).toBe(1)
    // A fabric without one shows its colour alone.
    expect(await table.locator('tr[data-fabric="background"]').getByRole('img', { name: /swatch image/ }).count()).toBe(0)
    const diagramImage = page.locator('[data-testid="cutting-diagram"][data-fabric="band"]').getByRole('img', { name: 'Rust check: swatch image' })
    await expect.poll(() => diagramImage.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(48)
    expect(pageErrors).toEqual([])

    // Another designer cannot read it: 404, as for an upload that does not exist.
    const other = await (await browser.newContext()).newPage()
    await signInThroughPage(other, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    expect(await other.evaluate(async (url) => (await fetch(url)).status, `/api/uploads/${swatch}`)).toBe(404)
    expect(await page.evaluate(async (url) => (await fetch(url)).status, `/api/uploads/${swatch}`)).toBe(200)
    await other.context().close()
    await context.close()
  })
})
