import fs from 'node:fs'
import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { wreathFile } from '@/lib/booklet/test-support/designs'
import { allText, openPdf } from '@/lib/booklet/test-support/read-pdf'
import { DEMO_PASSWORD } from '@/scripts/demo-data'
import { newPerson } from '../support/accounts'
import { createPatternFromPage } from '../support/board'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { firstLink, waitForMail } from '../support/mail'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('a test round', () => {
  it('a designer moves a pattern to testing and invites a new tester, who signs up from the e-mail, confirms, lands on the pattern and prints a marked test copy', async () => {
    // The designer's browser.
    const studio = await (await browser.newContext({ viewport: { width: 1280, height: 900 } })).newPage()
    const pageErrors: string[] = []
    studio.on('pageerror', (error) => pageErrors.push(String(error)))
    await signInThroughPage(studio, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    const name = `Test round ${Date.now()}`
    const patternId = await createPatternFromPage(studio, name, wreathFile({ name }))
    await studio.goto(`${baseUrl()}/patterns/${patternId}`)
    await studio.getByRole('button', { name: 'Move to testing' }).click()
    await expect.poll(() => studio.getByTestId('pattern-state-name').textContent()).toBe('in testing')
    await expect.poll(() => studio.getByTestId('state-history').textContent()).toContain('From a draft to in testing by Marguerite Okafor')
    // Publishing without a price is refused, saying why.
    await studio.getByRole('button', { name: 'Publish' }).click()
    await studio.getByRole('alert').filter({ hasText: 'it needs a price' }).waitFor()

    const tester = newPerson('Nia Bloom', 'flying-geese-at-dawn')
    await studio.getByLabel('Tester’s e-mail address').fill(tester.email)
    await studio.getByRole('button', { name: 'Invite' }).click()
    await studio.getByText(`Invitation sent to ${tester.email}.`).waitFor()
    await expect.poll(() => studio.getByTestId('invitations').textContent()).toContain('invited, no account confirmed yet')

    // The tester's browser: from the invitation e-mail to sign-up.
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 }, acceptDownloads: true })
    const page = await context.newPage()
    page.on('pageerror', (error) => pageErrors.push(String(error)))
    const invitation = await waitForMail({ to: tester.email, kind: 'tester-invitation' })
    expect(invitation.subject).toContain(name)
    await page.goto(firstLink(invitation, '/sign-up'))
    await page.getByLabel('Your name').fill(tester.displayName)
    await page.getByLabel('E-mail address').fill(tester.email)
    await page.getByLabel('Password (at least 10 characters)').fill(tester.password)
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor()

    // Confirming the address leads to the pattern, through sign-in.
    const verification = await waitForMail({ to: tester.email, kind: 'verify-email' })
    await page.goto(firstLink(verification, '/verify-email'))
    await page.getByRole('link', { name: 'Open the pattern you were invited to test' }).click()
    await page.waitForURL(/\/sign-in/)
    await page.getByLabel('E-mail address').fill(tester.email)
    await page.getByLabel('Password').fill(tester.password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(`${baseUrl()}/testing/${patternId}`)
    await page.getByRole('heading', { name }).waitFor()
    await page.getByTestId('print-footer').filter({ hasText: 'test copy – not for sale · Nia Bloom' }).waitFor()

    // Prints it in the second colourway on A4: every page says it is Nia's test copy.
    await page.getByLabel('Paper').selectOption('a4')
    await page.getByLabel('Colourway').selectOption('Frost')
    const download = page.waitForEvent('download')
    await page.getByRole('button', { name: /Download PDF \(\d+ pages\)/ }).click()
    const pdf = await openPdf(new Uint8Array(fs.readFileSync(await (await download).path())))
    const text = await allText(pdf)
    expect(text.split('test copy – not for sale · Nia Bloom').length - 1).toBe(pdf.numPages)
    expect(text).toContain('Frost')

    // The list of patterns to test has it; the designer sees the tester by name.
    await page.goto(`${baseUrl()}/testing`)
    await page.getByRole('link', { name, exact: true }).waitFor()
    await studio.reload()
    await expect.poll(() => studio.getByTestId('invitations').textContent()).toContain('Nia Bloom')
    expect(pageErrors).toEqual([])
  })

  it('shows a person who was not invited no such pattern', async () => {
    const studio = await (await browser.newContext()).newPage()
    await signInThroughPage(studio, 'marguerite@bramblelane.example', DEMO_PASSWORD)
    const patternId = await createPatternFromPage(studio, `Private ${Date.now()}`)
    const other = await (await browser.newContext()).newPage()
    await signInThroughPage(other, 'elsie@quilters.example', DEMO_PASSWORD)
    const response = await other.goto(`${baseUrl()}/testing/${patternId}`)
    expect(response?.status()).toBe(404)
    // The page itself, rendered in the browser (the not-found content comes in the streamed payload),
    // so that anything the policy refuses on it is seen before the browser closes.
    await other.getByTestId('not-found').waitFor()
  })
})
