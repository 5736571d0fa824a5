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
  it('names each bad field, answers alike for a new and a known address, lets the new quilter sign in before verifying, and signs out', async () => {
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
    await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor()
    expect(await page.getByRole('status').innerText()).toContain(email)

    // The same address again, in other letters' case, gets the very same answer: the page tells
    // nobody whether an address has an account (its owner gets an e-mail instead).
    const second = await browser.newContext()
    const again = await second.newPage()
    await again.goto(`${baseUrl()}/sign-up`)
    await again.getByLabel('Your name').fill('Someone Else')
    await again.getByLabel('E-mail address').fill(email.toUpperCase())
    await again.getByLabel('Password (at least 10 characters)').fill('another-long-password')
    await again.getByRole('button', { name: 'Create account' }).click()
    await again.getByRole('heading', { name: 'Check your e-mail' }).waitFor()
    await second.close()

    // Signed in before verifying: a quilter (the designer wish waits for an admin), with the banner.
    await page.getByRole('link', { name: 'Sign in' }).last().click()
    await page.getByLabel('E-mail address').fill(email)
    await page.getByLabel('Password').fill('running-stitch-blue')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.getByTestId('signed-in-as').waitFor()
    expect(await page.getByTestId('signed-in-as').innerText()).toBe('Hazel Marsh (quilter)')
    await page.getByRole('region', { name: 'Confirm your e-mail address' }).waitFor()

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.getByRole('link', { name: 'Sign in' }).first().waitFor()
    await page.goto(`${baseUrl()}/patterns`)
    await page.waitForURL(/\/sign-in/)
    await context.close()
  })
})
