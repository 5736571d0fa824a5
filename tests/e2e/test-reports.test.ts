/**
 * A test round's reports in Chromium: a tester files a report with a photo on area A3 from the
 * pattern's reports page; the designer shows the reports on the drafting board, finds its pin,
 * opens the thread (photo and all), answers and resolves it; the tester sees the answer and the
 * new state. Mail goes to the designer on the report and to the tester on the answer.
 *
 * The pattern is the demo's pattern in testing, made afresh for this run so other tests' state
 * changes cannot touch it: the designer moves it to testing and invites a tester who has an
 * account (PATCH /api/patterns/:id, POST /api/patterns/:id/invitations), who follows the
 * invitation's link. A new tester signing up from the invitation is tests/e2e/pattern-testing.test.ts.
 */
import type { Browser, Page } from 'playwright-core'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { DEMO_PASSWORD, DEMO_PATTERNS, DEMO_TEST_ROUND } from '@/scripts/demo-data'
import { createPatternFromPage } from '../support/board'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { firstLink, waitForMail } from '../support/mail'

const DESIGNER = DEMO_TEST_ROUND.designer
const TESTER = DEMO_TEST_ROUND.testers[1]
const LANTERN = DEMO_PATTERNS.find((demo) => demo.state === 'testing')!.design

let browser: Browser
let designer: Page
let tester: Page
let patternId: string
const pageErrors: string[] = []

async function personPage(email: string): Promise<Page> {
  const page = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage()
  page.on('pageerror', (error) => pageErrors.push(String(error)))
  await signInThroughPage(page, email, DEMO_PASSWORD)
  return page
}

beforeAll(async () => {
  browser = await launchBrowser()
  designer = await personPage(DESIGNER)
  tester = await personPage(TESTER)
  patternId = await createPatternFromPage(designer, `Lantern test round ${Date.now()}`, LANTERN)
  const statuses = await designer.evaluate(
    async ({ id, email }) => {
      const send = (method: string, path: string, body: unknown) =>
        fetch(path, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) }).then((response) => response.status)
      return [await send('PATCH', `/api/patterns/${id}`, { revision: 1, state: 'testing' }), await send('POST', `/api/patterns/${id}/invitations`, { email })]
    },
    { id: patternId, email: TESTER },
  )
  expect(statuses).toEqual([200, 201])
})
afterAll(async () => {
  await browser?.close()
})

/** A generated "photo": a rust block with a linen band, never a real photo. */
async function photoPng(): Promise<Buffer> {
  const band = await sharp({ create: { width: 320, height: 80, channels: 3, background: '#e8dcc4' } }).png().toBuffer()
  return sharp({ create: { width: 320, height: 240, channels: 3, background: '#8a4b2f' } }).composite([{ input: band, left: 0, top: 80 }]).png().toBuffer()
}

const REPORT_TEXT = `The rough-cut piece for A3 is short along the outer arc (${Date.now()}).`
const ANSWER = 'Thank you — the margin for A3 is now 1/2 in; please print page 3 again.'

describe('test reports', () => {
  it('a tester files a report with a photo on area A3', async () => {
    const invitation = await waitForMail({ to: TESTER, kind: 'tester-invitation' })
    await tester.goto(firstLink(invitation, `/testing/${patternId}`))
    await tester.getByRole('heading', { level: 1 }).waitFor()
    await tester.goto(`${baseUrl()}/patterns/${patternId}/reports`)
    const form = tester.getByRole('form', { name: 'File a report' })
    await form.getByLabel('What kind of problem').selectOption('cutting')
    await form.getByLabel('How much it matters').selectOption('blocks-sewing')
    await form.getByLabel('Area', { exact: true }).selectOption('A3')
    await form.getByLabel('What happened').fill(REPORT_TEXT)
    await form.getByLabel(/^Photos/).setInputFiles({ name: 'a3-gap.png', mimeType: 'image/png', buffer: await photoPng() })
    await expect.poll(() => form.getByRole('list', { name: 'Photos to send' }).getByRole('img').count(), { timeout: 15_000 }).toBe(1)
    await form.getByRole('button', { name: 'File the report' }).click()

    const thread = tester.getByTestId('report-thread')
    await expect.poll(() => thread.textContent(), { timeout: 15_000 }).toContain(REPORT_TEXT)
    expect(await thread.getByTestId('report-state').textContent()).toBe('Open')
    expect(await tester.getByTestId('report-row').count()).toBe(1)
    expect(await tester.getByTestId('report-row').textContent()).toContain('area A3')

    const mail = await waitForMail({ to: DESIGNER, kind: 'report-filed', subject: 'area A3' })
    expect(mail.text).toContain(REPORT_TEXT)
  })

  it('the designer sees its pin on the board, reads it with its photo, answers and resolves it', async () => {
    await designer.goto(`${baseUrl()}/patterns/${patternId}/board`)
    await designer.getByTestId('board-canvas').waitFor()
    await designer.getByRole('button', { name: 'Show test reports' }).click()
    const pin = designer.getByTestId('report-pin')
    await expect.poll(() => pin.count(), { timeout: 15_000 }).toBe(1)
    expect(await pin.getAttribute('aria-label')).toBe('Report 1: Cutting at area A3')
    // The pin stands inside the canvas, at A3's label in the first repeat.
    const canvas = (await designer.getByTestId('board-canvas').boundingBox())!
    const box = (await pin.boundingBox())!
    expect(box.x).toBeGreaterThan(canvas.x)
    expect(box.x + box.width).toBeLessThan(canvas.x + canvas.width)

    await pin.click()
    const thread = designer.getByRole('complementary', { name: 'Test report' }).getByTestId('report-thread')
    await expect.poll(() => thread.textContent()).toContain(REPORT_TEXT)
    const photo = thread.getByRole('img', { name: 'Photo 1 of the report' })
    await expect.poll(() => photo.evaluate((image: HTMLImageElement) => image.complete && image.naturalWidth), { timeout: 15_000 }).toBe(320)

    await thread.getByLabel('Your answer').fill(ANSWER)
    await thread.getByRole('button', { name: 'Send answer' }).click()
    await expect.poll(() => thread.getByTestId('report-message').count(), { timeout: 15_000 }).toBe(1)
    await thread.getByRole('button', { name: 'Mark resolved' }).click()
    await expect.poll(() => thread.getByTestId('report-state').textContent(), { timeout: 15_000 }).toBe('Resolved')
    // Only open reports are pinned.
    expect(await pin.count()).toBe(0)
  })

  it('the tester sees the answer and that the report is resolved', async () => {
    const mail = await waitForMail({ to: TESTER, kind: 'report-answered' })
    expect(mail.text).toContain(ANSWER)
    await tester.goto(`${baseUrl()}/patterns/${patternId}/reports`)
    await tester.getByTestId('report-row').getByRole('button').click()
    const thread = tester.getByTestId('report-thread')
    await expect.poll(() => thread.getByTestId('report-message').textContent(), { timeout: 15_000 }).toContain(ANSWER)
    expect(await thread.getByTestId('report-state').textContent()).toBe('Resolved')
    expect(await thread.getByRole('button', { name: 'Mark resolved' }).count()).toBe(0)
    expect(pageErrors).toEqual([])
  })

  it('a report on a point of the ring says so on the board once the designer redraws the area there', async () => {
    await tester.goto(`${baseUrl()}/patterns/${patternId}/reports`)
    const form = tester.getByRole('form', { name: 'File a report' })
    // A2's label point in the first repeat (geometry/plan.ts), clicked on the map of the ring.
    const [x, y] = await tester.getByTestId('report-map').evaluate((svg: SVGSVGElement) => {
      const at = new DOMPoint(8.45, -2.42).matrixTransform(svg.getScreenCTM()!)
      return [at.x, at.y]
    })
    await tester.mouse.click(x, y)
    await expect.poll(() => form.getByTestId('report-map').locator('..').textContent()).toContain('in area A2')
    await form.getByLabel('What kind of problem').selectOption('fit')
    await form.getByLabel('What happened').fill('The points do not meet here.')
    await form.getByRole('button', { name: 'File the report' }).click()
    await expect.poll(() => tester.getByTestId('report-row').count(), { timeout: 15_000 }).toBe(2)

    await designer.goto(`${baseUrl()}/patterns/${patternId}/board`)
    await designer.getByRole('button', { name: 'Show test reports' }).click()
    const pin = designer.getByTestId('report-pin')
    await expect.poll(() => pin.count(), { timeout: 15_000 }).toBe(1)
    expect(await pin.getAttribute('aria-label')).toBe('Report 1: Pieces do not fit at a point on the board')
    // Every seam taken out: one area is left, A1, where A2 was.
    await designer.evaluate(() => {
      const board = window.wreathwrightBoard!
      const present = board.getState().history.present
      board.run('replaceDesign', { design: { ...present, seams: [], leaves: [], order: undefined } })
    })
    await expect.poll(() => pin.getAttribute('aria-label')).toBe('Report 1: Pieces do not fit at a point on the board, the design has changed here since')
    await pin.click()
    const thread = designer.getByRole('complementary', { name: 'Test report' })
    await expect.poll(() => thread.getByRole('note').textContent()).toBe('The design has changed here since the report.')
  })
})

