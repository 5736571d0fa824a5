import type { Browser } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { newPerson, signUpAndVerify, signUpThroughPage, verifyThroughMail } from '../support/accounts'
import { baseUrl, launchBrowser, signInThroughPage } from '../support/browser'
import { firstLink, waitForMail } from '../support/mail'

let browser: Browser

beforeAll(async () => {
  browser = await launchBrowser()
})
afterAll(async () => {
  await browser?.close()
})

describe('an account from sign-up to a forgotten password, by e-mail', () => {
  it('signs up, verifies from the e-mail, signs out, resets the password from a second e-mail and signs in with the new one', async () => {
    const context = await browser.newContext()
    const page = await context.newPage()
    const person = newPerson('Juniper Vale')

    await signUpThroughPage(page, person)
    // Signed in before verifying: the banner asks to confirm the address.
    await signInThroughPage(page, person.email, person.password)
    await page.getByRole('region', { name: 'Confirm your e-mail address' }).waitFor()

    await verifyThroughMail(page, person.email)
    await page.goto(`${baseUrl()}/`)
    await page.getByTestId('signed-in-as').waitFor()
    expect(await page.getByRole('region', { name: 'Confirm your e-mail address' }).count()).toBe(0)

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.getByRole('link', { name: 'Sign in' }).first().waitFor()

    await page.goto(`${baseUrl()}/sign-in`)
    await page.getByRole('link', { name: 'Forgot your password?' }).click()
    await page.getByRole('heading', { name: 'Forgotten password' }).waitFor()
    await page.getByLabel('E-mail address').fill(person.email)
    await page.getByRole('button', { name: 'Send me a link' }).click()
    await page.getByText('we sent it a link to choose a new password', { exact: false }).waitFor()

    const resetMail = await waitForMail({ to: person.email, kind: 'password-reset' })
    await page.goto(firstLink(resetMail, '/reset-password/new'))
    // The token leaves the address bar once the page has read it.
    await page.waitForURL((url) => url.hash === '')
    const newPassword = 'feather-stitch-in-autumn'
    await page.getByLabel('New password (at least 10 characters)').fill('password1234')
    await page.getByRole('button', { name: 'Save the new password' }).click()
    await page.getByText('commonly used password', { exact: false }).waitFor()
    await page.getByLabel('New password (at least 10 characters)').fill(newPassword)
    await page.getByRole('button', { name: 'Save the new password' }).click()
    await page.getByText('Your password is changed.', { exact: false }).waitFor()
    await waitForMail({ to: person.email, kind: 'password-changed' })

    await page.goto(`${baseUrl()}/sign-in`)
    await page.getByLabel('E-mail address').fill(person.email)
    await page.getByLabel('Password').fill(person.password)
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.getByText('That e-mail address and password do not match an account.').waitFor()

    await signInThroughPage(page, person.email, newPassword)
    expect(await page.getByTestId('signed-in-as').innerText()).toContain('Juniper Vale')
    await context.close()
  })

  it('shows the account page: sessions, a name change, and signing out everywhere else', async () => {
    const person = newPerson('Rowan Ash')
    const first = await browser.newContext()
    const page = await first.newPage()
    await signUpAndVerify(page, person)
    await signInThroughPage(page, person.email, person.password)
    const second = await browser.newContext()
    const other = await second.newPage()
    await signInThroughPage(other, person.email, person.password)

    await page.getByTestId('signed-in-as').click()
    await page.waitForURL(/\/account$/)
    const sessions = page.getByRole('list', { name: 'Signed-in browsers' })
    await expect.poll(() => sessions.getByRole('listitem').count()).toBe(2)
    await page.getByText('this browser').waitFor()

    await page.getByLabel('Your name').fill('Rowan Ashdown')
    await page.getByRole('button', { name: 'Save the name' }).click()
    await page.getByTestId('signed-in-as').getByText('Rowan Ashdown').waitFor()

    await page.getByRole('button', { name: 'Sign out everywhere else' }).click()
    await page.getByText('Signed out of 1 other browser.').waitFor()
    await other.goto(`${baseUrl()}/account`)
    await other.waitForURL(/\/sign-in/)
    await first.close()
    await second.close()
  })
})
