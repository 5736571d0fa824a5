import { randomUUID } from 'node:crypto'
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { closeDatabase, database } from '@/lib/db'
import type { DesignFile } from '@/lib/schemas/design'
import type { PlanAnswer } from '@/lib/schemas/sewing-room'
import { readPlan } from '@/lib/sewing-room/plan-answer'
import { Invitation, Licence, Order, Pattern } from '@/models'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { createPatternRow, createUser, TEST_PASSWORD } from '../support/factories'

/**
 * The sewing room in the browser, against the built app: a quilter who bought the demo wreath
 * starts a project on a phone-sized page, ticks steps, sees them on a second device (another
 * browser context, signed in on its own), and a tick made while the connection fails waits in the
 * page (and across a reload) as "not saved yet" until it is saved; a tester starts one from their
 * invitation to a pattern in testing, which nobody else can.
 */

/** A phone held in one hand (an iPhone 12–15 sized window, common practice for mobile checks). */
const PHONE = { viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true, deviceScaleFactor: 2 }

let browser: Browser
const contexts: BrowserContext[] = []

beforeAll(async () => {
  browser = await launchBrowser()
  database()
})
afterAll(async () => {
  for (const context of contexts) await context.close()
  await browser?.close()
  await closeDatabase()
})

async function newContext(options: Parameters<Browser['newContext']>[0] = {}): Promise<BrowserContext> {
  const context = await browser.newContext(options)
  contexts.push(context)
  return context
}

/** The demo wreath, published, and a new quilter holding a licence to it (buying is checkout.test.ts's business). */
async function quilterWithTheWreath(name: string) {
  const pattern = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
  if (!pattern) throw new Error('the demo data has no Hollyberry Wreath')
  await pattern.update({ state: 'published', priceCents: pattern.priceCents ?? 1400, currency: pattern.currency ?? 'USD' })
  const quilter = await createUser({ displayName: name, email: `${name.toLowerCase().replace(/\W+/g, '-')}-${Date.now()}@example.test` })
  const order = await Order.create({ id: randomUUID(), buyerId: quilter.id, patternId: pattern.id, amountCents: 1400, currency: 'USD', checkoutSessionId: `cs_test_${randomUUID()}`, state: 'paid' })
  const licence = await Licence.create({ userId: quilter.id, patternId: pattern.id, orderId: order.id })
  await licence.reload()
  return { quilter, licence }
}

/**
 * Starts a project of the licence and waits for its page; returns its id. The library links each
 * licence to its start page, and fits the screen, a phone's too (nothing to scroll sideways); the
 * project is started from the sewing room's own list, which names the same start page.
 */
async function startFromLibrary(page: Page, licenceId: string, name: string): Promise<string> {
  await page.goto(`${baseUrl()}/library`)
  const link = page.locator(`[data-testid="licence-row"] a[href="/sewing-room/new?licence=${licenceId}"]`)
  expect(await link.textContent()).toBe('Sewing room')
  expect(await link.isVisible()).toBe(true)
  expect(await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth)).toBeLessThanOrEqual(0)
  await page.goto(`${baseUrl()}/sewing-room`)
  await page.locator(`[data-testid="startable"] a[href="/sewing-room/new?licence=${licenceId}"]`).click()
  await page.getByRole('heading', { name: /Start a project: Hollyberry Wreath/ }).waitFor()
  // Each colourway is shown with its fabrics' swatches.
  expect(await page.getByTestId('colorway-swatches').first().locator('svg').count()).toBeGreaterThan(1)
  await page.getByLabel('Name (optional)').fill(name)
  await page.getByLabel('Paper').selectOption('a4')
  await page.getByRole('button', { name: 'Start the project' }).click()
  await page.waitForURL(/\/sewing-room\/[0-9a-f-]{36}$/)
  await page.getByTestId('next-step').waitFor()
  return page.url().split('/').at(-1)!
}

const stepRow = (page: Page, stepId: string) => page.locator(`[data-testid="step"][data-step-id="${stepId}"]`)
const doneOf = (page: Page, stepId: string) => stepRow(page, stepId).getAttribute('data-done')
const nextStepId = (page: Page) => page.getByTestId('next-step').getAttribute('data-step-id')

/** Ticks the next step with the bar at the bottom of a phone's screen; returns the step's id. */
async function tickNextWithThumb(page: Page): Promise<string> {
  const stepId = (await nextStepId(page))!
  await page.getByRole('button', { name: /^Done: / }).click()
  await expect.poll(() => doneOf(page, stepId)).toBe('true')
  await expect.poll(() => nextStepId(page)).not.toBe(stepId)
  return stepId
}

async function waitUntilAllSaved(page: Page): Promise<void> {
  await expect.poll(() => page.getByTestId('save-status').getAttribute('data-waiting'), { timeout: 15_000 }).toBe('0')
}

describe('the sewing room', () => {
  it('keeps a project’s ticks on the server: ticked on a phone, seen and unticked on a second device, seen back on the phone', async () => {
    const { quilter, licence } = await quilterWithTheWreath('Marit Okafor')
    const phone = await (await newContext(PHONE)).newPage()
    await signInThroughPage(phone, quilter.email, TEST_PASSWORD)
    const projectId = await startFromLibrary(phone, licence.id, 'For the hall')
    await expect.poll(() => phone.getByRole('heading', { level: 1 }).textContent()).toBe('For the hall')

    // One-handed: "done" and "undo" sit at the bottom of the screen and are large enough for a thumb.
    const done = phone.getByRole('button', { name: /^Done: / })
    const box = (await done.boundingBox())!
    expect(box.y + box.height).toBeGreaterThan(844 * 0.85)
    expect(box.height).toBeGreaterThanOrEqual(44)
    expect(await phone.getByRole('button', { name: /^Undo/ }).isDisabled()).toBe(true)

    // The picture starts in outline.
    const sewnAreas = () => phone.locator('[data-testid="ring-picture"] polygon[data-sewn="true"]').count()
    expect(await sewnAreas()).toBe(0)

    const ticked = [await tickNextWithThumb(phone), await tickNextWithThumb(phone), await tickNextWithThumb(phone)]
    await waitUntilAllSaved(phone)
    await expect.poll(() => phone.getByTestId('overall-progress').textContent()).toMatch(/^3 of \d+ steps$/)
    // Undo takes back the last tick; ticking again puts it back.
    await phone.getByRole('button', { name: /^Undo/ }).click()
    await expect.poll(() => doneOf(phone, ticked[2]!)).toBe('false')
    await expect.poll(() => nextStepId(phone)).toBe(ticked[2])
    expect(await tickNextWithThumb(phone)).toBe(ticked[2])
    await waitUntilAllSaved(phone)

    // A second device: a context of its own, signed in separately.
    const desk = await (await newContext({ viewport: { width: 1280, height: 900 } })).newPage()
    await signInThroughPage(desk, quilter.email, TEST_PASSWORD)
    await desk.goto(`${baseUrl()}/sewing-room`)
    await desk.getByTestId('project-card').filter({ hasText: 'For the hall' }).click()
    await desk.waitForURL(`${baseUrl()}/sewing-room/${projectId}`)
    for (const stepId of ticked) await expect.poll(() => doneOf(desk, stepId)).toBe('true')
    await expect.poll(() => desk.getByTestId('overall-progress').textContent()).toMatch(/^3 of /)

    // It unticks the second step there, opening that step's group if it is closed.
    const second = stepRow(desk, ticked[1]!)
    if (!(await second.isVisible())) {
      const group = desk.getByTestId('checklist-group').filter({ has: desk.locator(`[data-step-id="${ticked[1]}"]`) })
      await group.getByRole('button', { expanded: false }).first().click()
    }
    await second.getByRole('checkbox').uncheck()
    await expect.poll(() => doneOf(desk, ticked[1]!)).toBe('false')
    await waitUntilAllSaved(desk)

    // The phone sees it when it comes back into view, without a reload; its other ticks stand. It
    // asks with the tag of the plan it has, so asking again with nothing changed brings back 304
    // and no plan.
    const answers: number[] = []
    phone.on('response', (response) => {
      if (new URL(response.url()).pathname === `/api/sewing-room/projects/${projectId}`) answers.push(response.status())
    })
    await phone.evaluate(() => window.dispatchEvent(new Event('focus')))
    await expect.poll(() => doneOf(phone, ticked[1]!)).toBe('false')
    await phone.evaluate(() => window.dispatchEvent(new Event('focus')))
    await expect.poll(() => answers).toEqual([200, 304])
    expect(await doneOf(phone, ticked[0]!)).toBe('true')
    expect(await doneOf(phone, ticked[2]!)).toBe('true')
    expect(await nextStepId(phone)).toBe(ticked[1])
  })

  it('keeps a tick whose request failed, as "not saved yet", across a reload, until it is saved', async () => {
    const { quilter, licence } = await quilterWithTheWreath('Ines Harrow')
    const context = await newContext(PHONE)
    const page = await context.newPage()
    await signInThroughPage(page, quilter.email, TEST_PASSWORD)
    const projectId = await startFromLibrary(page, licence.id, 'Test of patience')

    // The connection drops for the step requests (only those: the page itself still loads).
    const steps = `**/api/sewing-room/projects/${projectId}/steps`
    let failed = 0
    await context.route(steps, async (route) => {
      failed += 1
      await route.abort('internetdisconnected')
    })
    const stepId = (await nextStepId(page))!
    await page.getByRole('button', { name: /^Done: / }).click()
    await expect.poll(() => failed).toBeGreaterThan(0)
    await expect.poll(() => stepRow(page, stepId).getByTestId('step-save-state').textContent()).toMatch(/^Not saved yet/)
    expect(await page.getByTestId('save-status').textContent()).toMatch(/1 change not saved yet/)
    expect(await doneOf(page, stepId)).toBe('true')

    // A reload with the connection still down: the tick is still shown, still waiting.
    await page.reload()
    await page.getByTestId('project-room').waitFor()
    await expect.poll(() => doneOf(page, stepId)).toBe('true')
    await expect.poll(() => stepRow(page, stepId).getAttribute('data-save-state')).toBe('waiting')

    // The connection comes back: the next try saves it.
    await context.unroute(steps)
    // "Try now" is offered only while the next try is a second or more away; when the queue's
    // own try comes first the button goes (between a look and a click), and that try saves it.
    await page.getByRole('button', { name: 'Try now' }).click({ timeout: 2_000 }).catch(() => undefined)
    await waitUntilAllSaved(page)
    await expect.poll(() => stepRow(page, stepId).getByTestId('step-save-state').textContent()).toMatch(/Saved/)
    const server = await page.request.get(`${baseUrl()}/api/sewing-room/projects/${projectId}`)
    const detail = readPlan((await server.json()) as PlanAnswer)
    expect(detail.steps.find((step) => step.id === stepId)?.done).toBe(true)
    expect(await page.evaluate(() => Object.keys(localStorage).filter((key) => key.startsWith('wreathwright.sewing-room.pending.')))).toEqual([])
  })

  it('lets a tester start a project from their invitation to a pattern in testing, and nobody else', async () => {
    const demo = await Pattern.findOne({ where: { name: 'Hollyberry Wreath' } })
    if (!demo) throw new Error('the demo data has no Hollyberry Wreath')
    const stamp = Date.now()
    const designer = await createUser({ displayName: 'Ines Testbed', roles: ['designer', 'quilter'], email: `ines-${stamp}@example.test` })
    const pattern = await createPatternRow(designer, { name: `Rosehip Test Ring ${stamp}`, state: 'testing', design: demo.design as DesignFile })
    const tester = await createUser({ displayName: 'Tove Tester', email: `tove-${stamp}@example.test` })
    const invitation = await Invitation.create({
      patternId: pattern.id, email: tester.email, invitedById: designer.id, userId: tester.id, acceptedAt: new Date(), withdrawnAt: null, expiresAt: new Date(Date.now() + 7 * 86_400_000),
    })
    const page = await (await newContext(PHONE)).newPage()
    await signInThroughPage(page, tester.email, TEST_PASSWORD)
    await page.goto(`${baseUrl()}/sewing-room/new?testing=${pattern.id}`)
    await page.getByRole('heading', { name: `Start a project: ${pattern.name}` }).waitFor()
    await page.getByRole('button', { name: 'Start the project' }).click()
    await page.waitForURL(/\/sewing-room\/[0-9a-f-]{36}$/)
    await page.getByTestId('next-step').waitFor()
    const projectId = page.url().split('/').at(-1)!
    const detail = (await (await page.request.get(`${baseUrl()}/api/sewing-room/projects/${projectId}`)).json()) as { project: { invitationId: string | null; licenceId: string | null } }
    expect(detail.project).toMatchObject({ invitationId: invitation.id, licenceId: null })

    // A quilter without an invitation finds no such page.
    const stranger = await createUser({ displayName: 'Una Uninvited', email: `una-${stamp}@example.test` })
    const other = await (await newContext()).newPage()
    await signInThroughPage(other, stranger.email, TEST_PASSWORD)
    const answer = await other.goto(`${baseUrl()}/sewing-room/new?testing=${pattern.id}`)
    expect(answer?.status()).toBe(404)
  })
})
