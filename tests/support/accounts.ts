import type { Page } from 'playwright-core'
import { baseUrl } from './browser'
import { firstLink, waitForMail } from './mail'

/** A person who signs up in an end-to-end test; the address is new on every run. */
export interface NewPerson {
  readonly displayName: string
  readonly email: string
  readonly password: string
}

/** A new person with an address no earlier run used (the mail catcher keeps its messages). */
export function newPerson(name = 'Juniper Vale', password = 'running-stitch-blue'): NewPerson {
  const local = name.toLowerCase().replace(/[^a-z]+/g, '.')
  return { displayName: name, email: `${local}.${Date.now()}.${Math.floor(Math.random() * 1e6)}@example.test`, password }
}

/** Fills in the sign-up page and waits for its "check your e-mail". */
export async function signUpThroughPage(page: Page, person: NewPerson, options: { wantsDesigner?: boolean } = {}): Promise<void> {
  await page.goto(`${baseUrl()}/sign-up`)
  await page.getByLabel('Your name').fill(person.displayName)
  await page.getByLabel('E-mail address').fill(person.email)
  await page.getByLabel('Password (at least 10 characters)').fill(person.password)
  if (options.wantsDesigner) await page.getByLabel(/I design patterns/).check()
  await page.getByRole('button', { name: 'Create account' }).click()
  await page.getByRole('heading', { name: 'Check your e-mail' }).waitFor()
}

/** Opens the newest verification e-mail's link, read through the mail catcher's API, and waits for the confirmation. */
export async function verifyThroughMail(page: Page, email: string): Promise<void> {
  const mail = await waitForMail({ to: email, kind: 'verify-email' })
  await page.goto(firstLink(mail, '/verify-email'))
  await page.getByText('Thank you: your e-mail address is confirmed.').waitFor()
}

/** Signs up through the page and verifies the address from the e-mail: a person ready to sign in. */
export async function signUpAndVerify(page: Page, person: NewPerson = newPerson(), options: { wantsDesigner?: boolean } = {}): Promise<NewPerson> {
  await signUpThroughPage(page, person, options)
  await verifyThroughMail(page, person.email)
  return person
}
