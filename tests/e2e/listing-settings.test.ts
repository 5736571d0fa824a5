/**
 * The designer's listing settings in Chromium: on the pattern's page a designer writes skill notes
 * (too long is refused beside the field, by the schema the server shares), uploads a cover, and a
 * visitor who is not signed in sees both in the shop; removing the cover brings the drawn ring
 * back. Every page runs with nothing refused by the Content-Security-Policy (launchBrowser fails on
 * any refusal).
 */
import sharp from 'sharp'
import type { Browser, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import { MAX_SKILL_NOTES_LENGTH } from '@/lib/limits'
import { Pattern } from '@/models'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

/** A season pattern of the demo designer with no uploaded cover (scripts/demo-covers.ts gives two others one). */
const PATTERN_NAME = 'Sloe Berry Ring'
const DESIGNER = 'marguerite@bramblelane.example'

let browser: Browser
let pattern: Pattern
let before: { skillNotes: string | null; coverUploadId: string | null }

beforeAll(async () => {
  browser = await launchBrowser()
  database()
  const found = await Pattern.findOne({ where: { name: PATTERN_NAME }, attributes: ['id', 'skillNotes', 'coverUploadId'] })
  if (!found) throw new Error(`the demo data has no pattern called ${PATTERN_NAME}`)
  pattern = found
  before = { skillNotes: found.skillNotes, coverUploadId: found.coverUploadId }
  // On sale and listed, whatever earlier tests did to it (publishing is the studio's business).
  await Pattern.update({ state: 'published', hiddenAt: null, coverUploadId: null }, { where: { id: found.id }, hooks: false })
})
afterAll(async () => {
  // The demo's listing as it was, for the tests after this one.
  await Pattern.update(before, { where: { id: pattern.id }, hooks: false })
  await browser?.close()
  await closeDatabase()
})

/** A made-up cover, never a photo: a plum ground with a pale ring, 1200 px square. */
async function coverPicture(): Promise<Buffer> {
  const svg = '<svg xmlns="http://www.w3.org/2000/svg" width="1200" height="1200"><rect width="100%" height="100%" fill="#5c2a4a"/><circle cx="600" cy="600" r="380" fill="none" stroke="#ece4f0" stroke-width="90"/></svg>'
  return sharp(Buffer.from(svg)).png().toBuffer()
}

/** Whether an image element finished loading with pixels (a refused or broken one has none). */
const loaded = (page: Page, testId: string) =>
  page.getByTestId(testId).first().evaluate((image) => (image as HTMLImageElement).complete && (image as HTMLImageElement).naturalWidth > 0)

describe('the designer’s listing settings', () => {
  it('sets skill notes and a cover that a visitor sees in the shop, and removing the cover brings the drawn ring back', async () => {
    const designer = await (await browser.newContext()).newPage()
    await signInThroughPage(designer, DESIGNER, DEMO_PASSWORD)
    await designer.goto(`${baseUrl()}/patterns/${pattern.id}`)
    const settings = designer.getByTestId('listing-settings')
    await settings.waitFor()
    await settings.getByTestId('no-cover').waitFor()

    // Too long: refused beside the field, before anything is sent.
    const notes = settings.getByRole('textbox', { name: 'Skill notes' })
    await notes.fill('x'.repeat(MAX_SKILL_NOTES_LENGTH + 1))
    await settings.getByRole('button', { name: 'Save the skill notes' }).click()
    await settings.getByText(`Keep the skill notes to ${MAX_SKILL_NOTES_LENGTH} characters.`).waitFor()
    await expect(notes.getAttribute('aria-invalid')).resolves.toBe('true')

    const written = 'Six rotated wedges with sharp plum points.\nA calm first ring for a confident beginner.'
    await notes.fill(written)
    await settings.getByRole('button', { name: 'Save the skill notes' }).click()
    await expect.poll(() => settings.getByTestId('listing-message').textContent()).toBe('Skill notes saved.')

    // The cover: chosen as a file, uploaded, then named; the preview is the stored image.
    await designer.setInputFiles('#cover-file', { name: 'sloe-cover.png', mimeType: 'image/png', buffer: await coverPicture() })
    await expect.poll(() => settings.getByTestId('listing-message').textContent(), { timeout: 20_000 }).toBe('Cover saved: the shop shows it.')
    await settings.getByTestId('cover-preview').waitFor()
    await expect.poll(() => loaded(designer, 'cover-preview')).toBe(true)
    const coverUploadId = (await Pattern.findByPk(pattern.id, { attributes: ['coverUploadId'] }))!.coverUploadId
    expect(coverUploadId).toBeTruthy()

    // A visitor, not signed in: the card and the pattern's page show the uploaded cover and the notes.
    const visitor = await (await browser.newContext()).newPage()
    await visitor.goto(`${baseUrl()}/shop?q=${encodeURIComponent(PATTERN_NAME)}`)
    // The card linking to this pattern (other tests list patterns whose names start the same way).
    const card = visitor.getByTestId('listing-card').filter({ has: visitor.locator(`a[href="/shop/${pattern.id}"]`) })
    await card.waitFor()
    await expect(card.getByTestId('uploaded-cover').getAttribute('src')).resolves.toBe(`/api/shop/covers/${coverUploadId}`)
    await expect.poll(() => card.getByTestId('uploaded-cover').evaluate((image) => (image as HTMLImageElement).naturalWidth)).toBeGreaterThan(0)
    expect(await card.getByTestId('ring-cover').count()).toBe(0)
    await visitor.goto(`${baseUrl()}/shop/${pattern.id}`)
    await expect.poll(() => loaded(visitor, 'uploaded-cover')).toBe(true)
    await expect(visitor.getByTestId('skill-notes').textContent()).resolves.toBe(written)

    // Removed: the designer's page says the ring is shown, and so it is.
    await settings.getByRole('button', { name: 'Remove the cover' }).click()
    await expect.poll(() => settings.getByTestId('listing-message').textContent()).toBe('Cover removed: the shop shows the drawn ring again.')
    await settings.getByTestId('no-cover').waitFor()
    await visitor.goto(`${baseUrl()}/shop?q=${encodeURIComponent(PATTERN_NAME)}`)
    await card.getByTestId('ring-cover').waitFor()
    expect(await card.getByTestId('uploaded-cover').count()).toBe(0)
    // The image is no longer served to anyone.
    expect((await fetch(`${baseUrl()}/api/shop/covers/${coverUploadId}`)).status).toBe(404)
  })
})
