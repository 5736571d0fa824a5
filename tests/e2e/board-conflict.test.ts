/**
 * Two browser contexts, both signed in as the same designer, edit one pattern on the drafting
 * board. Whoever saves second meets the conflict dialog, and neither choice loses the other side.
 * The pattern is made through the API for this file alone, so the demo patterns do not matter.
 *
 * The change made on the board is the ring's "Repeats" number input (committed on blur), which
 * sets `ring.repeats`; every value used is even so alternate mirroring would stay valid too.
 */
import type { Browser, BrowserContext, Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { DesignFile } from '@/lib/schemas/design'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'

const DESIGNER = 'marguerite@bramblelane.example'
/** The autosave waits 1 s after the last change; the rest is the request and a re-render. */
const SAVE_TIMEOUT_MS = 15_000

interface Tab {
  readonly context: BrowserContext
  readonly page: Page
  readonly consoleErrors: string[]
}

interface SavedPattern {
  readonly id: string
  readonly revision: number
  readonly design: DesignFile
}

let browser: Browser
let first: Tab
let second: Tab
let patternId: string

async function openTab(): Promise<Tab> {
  const context = await browser.newContext({ viewport: { width: 1280, height: 800 } })
  const page = await context.newPage()
  const consoleErrors: string[] = []
  page.on('console', (message) => message.type() === 'error' && consoleErrors.push(message.text()))
  // A leave-page prompt must never hang a test; none is expected once everything is saved.
  page.on('dialog', (dialog) => void dialog.accept())
  await signInThroughPage(page, DESIGNER, DEMO_PASSWORD)
  return { context, page, consoleErrors }
}

/** Calls the API from inside the page, so the request carries the session cookie and Origin. */
async function api<T>(page: Page, path: string, init: { method?: string; json?: unknown } = {}): Promise<{ status: number; body: T }> {
  return page.evaluate(
    async ({ path, method, json }) => {
      const response = await fetch(path, {
        method: method ?? 'GET',
        headers: json === undefined ? { accept: 'application/json' } : { accept: 'application/json', 'content-type': 'application/json' },
        body: json === undefined ? undefined : JSON.stringify(json),
      })
      return { status: response.status, body: (await response.json()) as T }
    },
    { path, method: init.method, json: init.json },
  )
}

async function savedPattern(page: Page): Promise<SavedPattern> {
  const { body } = await api<{ pattern: SavedPattern }>(page, `/api/patterns/${patternId}`)
  return body.pattern
}

async function openBoard(tab: Tab): Promise<void> {
  await tab.page.goto(`${baseUrl()}/patterns/${patternId}/board`)
  await waitForSaveState(tab, 'saved')
}

function waitForSaveState(tab: Tab, state: string): Promise<void> {
  return tab.page.locator(`[data-testid="save-status"][data-state="${state}"]`).waitFor({ timeout: SAVE_TIMEOUT_MS })
}

const repeatsInput = (tab: Tab) => tab.page.getByLabel('Repeats', { exact: true })

async function setRepeats(tab: Tab, repeats: number): Promise<void> {
  await repeatsInput(tab).fill(String(repeats))
  await repeatsInput(tab).press('Tab')
}

/** Waits until the server holds `revision`, then for the tab to say so. */
async function waitUntilSaved(tab: Tab, revision: number): Promise<SavedPattern> {
  await expect.poll(async () => (await savedPattern(tab.page)).revision, { timeout: SAVE_TIMEOUT_MS }).toBe(revision)
  await waitForSaveState(tab, 'saved')
  return savedPattern(tab.page)
}

const conflictDialog = (tab: Tab) => tab.page.getByRole('dialog', { name: 'This pattern was changed somewhere else' })

beforeAll(async () => {
  browser = await launchBrowser()
  first = await openTab()
  second = await openTab()
  const created = await api<{ pattern: SavedPattern }>(first.page, '/api/patterns', {
    method: 'POST',
    json: { name: `Two-tab Wreath ${Date.now()}` },
  })
  expect(created.status).toBe(201)
  patternId = created.body.pattern.id
  expect(created.body.pattern).toMatchObject({ revision: 1, design: { ring: { repeats: 4 } } })
})

afterAll(async () => {
  await browser?.close()
})

describe('two tabs editing the same pattern on the drafting board', () => {
  it('stops the second save with the conflict dialog, and "Load the saved version" shows the other tab’s change', async () => {
    await openBoard(first)
    await openBoard(second)

    await setRepeats(first, 6)
    expect(await waitUntilSaved(first, 2)).toMatchObject({ revision: 2, design: { ring: { repeats: 6 } } })

    // The second tab still works from revision 1: its save is refused and nothing is written.
    await setRepeats(second, 8)
    await conflictDialog(second).waitFor({ timeout: SAVE_TIMEOUT_MS })
    expect(await second.page.getByTestId('save-status').getAttribute('data-state')).toBe('conflict')
    expect(await second.page.getByTestId('save-status').innerText()).toContain('Changed elsewhere')
    expect(await savedPattern(second.page)).toMatchObject({ revision: 2, design: { ring: { repeats: 6 } } })
    // The dialog takes the keyboard: its first choice has the focus.
    await expect.poll(() => second.page.evaluate(() => document.activeElement?.textContent)).toBe('Load the saved version')

    await conflictDialog(second).getByRole('button', { name: 'Load the saved version' }).click()
    await conflictDialog(second).waitFor({ state: 'hidden' })
    await waitForSaveState(second, 'saved')
    expect(await repeatsInput(second).inputValue()).toBe('6')
    // Reloading theirs writes nothing.
    expect((await savedPattern(second.page)).revision).toBe(2)
  })

  it('saves the second tab’s version as a new revision with "Keep my version", the other tab’s change kept in the history', async () => {
    // Both tabs now stand on revision 2.
    await setRepeats(first, 10)
    expect(await waitUntilSaved(first, 3)).toMatchObject({ design: { ring: { repeats: 10 } } })

    await setRepeats(second, 12)
    await conflictDialog(second).waitFor({ timeout: SAVE_TIMEOUT_MS })
    expect((await savedPattern(second.page)).design.ring.repeats).toBe(10)

    await conflictDialog(second).getByRole('button', { name: 'Keep my version as a new revision' }).click()
    await conflictDialog(second).waitFor({ state: 'hidden' })
    expect(await waitUntilSaved(second, 4)).toMatchObject({ revision: 4, design: { ring: { repeats: 12 } } })
    expect(await repeatsInput(second).inputValue()).toBe('12')

    const { body } = await api<{ revisions: { revision: number }[] }>(second.page, `/api/patterns/${patternId}/revisions`)
    // Revision 3 is the first tab's 10 repeats, revision 4 the second tab's 12 on top of it.
    expect(body.revisions.map((revision) => revision.revision)).toEqual([4, 3, 2, 1])
  })

  it('offers back a draft the browser kept when the board was closed before saving', async () => {
    const saved = await savedPattern(first.page)
    // What the board writes on every change, as if the tab had crashed before the save went out.
    const draft = {
      patternId,
      baseRevision: saved.revision,
      savedAt: new Date().toISOString(),
      design: { ...saved.design, ring: { ...saved.design.ring, repeats: 14 } },
    }
    await first.page.evaluate(({ key, value }) => localStorage.setItem(key, value), {
      key: `wreathwright:draft:${patternId}`,
      value: JSON.stringify(draft),
    })
    await first.page.reload()
    const banner = first.page.getByTestId('draft-recovery')
    await banner.waitFor({ timeout: SAVE_TIMEOUT_MS })
    expect(await repeatsInput(first).inputValue()).toBe('12')

    await banner.getByRole('button', { name: 'Restore those changes' }).click()
    await banner.waitFor({ state: 'hidden' })
    expect(await repeatsInput(first).inputValue()).toBe('14')
    expect(await waitUntilSaved(first, 5)).toMatchObject({ design: { ring: { repeats: 14 } } })
    expect(await first.page.evaluate((key) => localStorage.getItem(key), `wreathwright:draft:${patternId}`)).toBeNull()
  })

  it('logged no errors in either browser besides the refused saves', () => {
    // Chromium reports every 409 answer on the console; those are the conflicts this file provokes.
    const unexpected = [...first.consoleErrors, ...second.consoleErrors].filter((text) => !text.includes('status of 409'))
    expect(unexpected).toEqual([])
  })
})
