import type { Browser, Page } from 'playwright-core'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { launchBrowser, signInThroughPage } from './browser'

type Point = readonly [number, number]

/**
 * Where a point of the ring's frame (design units, fabric side) appears on the page: the board
 * canvas's box plus the store's view (centre in pixels, zoom in pixels per unit, y up).
 */
export async function screenPointOf(page: Page, point: Point): Promise<[number, number]> {
  const box = await page.getByTestId('board-canvas').boundingBox()
  if (!box) throw new Error('the board canvas is not on the page')
  const view = await page.evaluate(() => window.wreathwrightBoard!.getState().view)
  return [box.x + view.centre[0] + point[0] * view.zoom, box.y + view.centre[1] - point[1] * view.zoom]
}

/** Draws a seam with the mouse: press at one end, drag in a few steps, release at the other. */
export async function dragSeam(page: Page, from: Point, to: Point): Promise<void> {
  const [x0, y0] = await screenPointOf(page, from)
  const [x1, y1] = await screenPointOf(page, to)
  await page.mouse.move(x0, y0)
  await page.mouse.down()
  await page.mouse.move((x0 + x1) / 2, (y0 + y1) / 2, { steps: 4 })
  await page.mouse.move(x1, y1, { steps: 4 })
  await page.mouse.up()
}

export async function clickAt(page: Page, point: Point): Promise<void> {
  const [x, y] = await screenPointOf(page, point)
  await page.mouse.click(x, y)
}

/** The design on the board, as the store holds it. */
export function boardDesign(page: Page) {
  return page.evaluate(() => window.wreathwrightBoard!.getState().history.present)
}

/**
 * Creates a pattern through the API, from the signed-in page, and returns its id: an empty ring,
 * or the design given (sent as text, so any JSON goes, even what the schema will refuse).
 */
export async function createPatternFromPage(page: Page, name: string, design?: unknown): Promise<string> {
  return page.evaluate(async (body) => {
    const response = await fetch('/api/patterns', { method: 'POST', headers: { 'content-type': 'application/json' }, body })
    const answer = (await response.json()) as { pattern: { id: string } }
    return answer.pattern.id
  }, JSON.stringify(design === undefined ? { name } : { name, design }))
}

/** A desktop browser signed in as the demo designer, for the board's tests, and the page's errors. */
export interface DesignerAtTheBoard {
  readonly browser: Browser
  readonly page: Page
  /** Every uncaught error of the page, to be empty at the end of a test. */
  readonly pageErrors: string[]
}

/** Launches Chromium, opens a 1280 × 800 page and signs in as the demo designer Marguerite. */
export async function designerAtTheBoard(): Promise<DesignerAtTheBoard> {
  const browser = await launchBrowser()
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
  const page = await context.newPage()
  const pageErrors: string[] = []
  page.on('pageerror', (error) => pageErrors.push(String(error)))
  await signInThroughPage(page, 'marguerite@bramblelane.example', DEMO_PASSWORD)
  return { browser, page, pageErrors }
}
