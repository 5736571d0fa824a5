import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { baseUrl, launchBrowser } from '../support/browser'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('creating an account through the page', () => {
  it('names each bad field, then signs the new designer in to an empty shelf, and signs out', async () => {
    const context = await browser.newContext()
    const page = await context.newPage()
    await page.goto(`${baseUrl()}/sign-up`)

    await page.getByLabel('E-mail address').fill('not an address')
    await page.getByLabel('Password (at least 10 characters)').fill('short')
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.getByText('Tell us your name.').waitFor()
    await page.getByText('Enter a valid e-mail address.').waitFor()
    await page.getByText('Use at least 10 characters.').waitFor()

    const email = `hazel.marsh.${Date.now()}@example.test`
    await page.getByLabel('Your name').fill('Hazel Marsh')
    await page.getByLabel('E-mail address').fill(email)
    await page.getByLabel('Password (at least 10 characters)').fill('running-stitch-blue')
    await page.getByLabel(/I design patterns/).check()
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.waitForURL(/\/patterns$/)
    await page.getByText('No patterns yet.', { exact: false }).waitFor()
    expect(await page.getByTestId('signed-in-as').innerText()).toContain('Hazel Marsh')

    // The same address again, in other letters' case, is refused on the e-mail field.
    const second = await browser.newContext()
    const again = await second.newPage()
    await again.goto(`${baseUrl()}/sign-up`)
    await again.getByLabel('Your name').fill('Someone Else')
    await again.getByLabel('E-mail address').fill(email.toUpperCase())
    await again.getByLabel('Password (at least 10 characters)').fill('another-long-password')
    await again.getByRole('button', { name: 'Create account' }).click()
    await again.getByText('An account with this e-mail address already exists.').first().waitFor()
    await second.close()

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.getByRole('link', { name: 'Sign in' }).first().waitFor()
    await page.goto(`${baseUrl()}/patterns`)
    await page.waitForURL(/\/sign-in/)
    await context.close()
  })
})
