import { QueryTypes } from 'sequelize'
import { afterAll, beforeAll } from 'vitest'
import { database } from '@/lib/db'
import type { MailKind } from '@/lib/mail/kinds'
import { closeQueueSender, QUEUE_SCHEMA } from '@/lib/jobs/boss'
import { KIND_HEADER, startMailWorker, stopMailWorker } from '@/lib/mail/worker'

/**
 * Reading what the app sent, through the mail catcher's JSON API (maildev; scripts/run-tests.ts
 * starts it and sets MAIL_CATCHER_URL for the integration and the end-to-end tests).
 *
 *   useMailWorker()                                   // integration tests: a worker in this process
 *   beforeEach(() => Promise.all([clearMails(), clearMailQueue()]))   // start from no message at all
 *   const mail = await waitForMail({ to: 'ada@example.com', kind: 'verify-email' })
 *   const link = firstLink(mail, '/verify-email')     // 'http://127.0.0.1:…/verify-email?token=…'
 */

export interface CaughtMail {
  id: string
  subject: string
  /** As the header reads, e.g. `Wreathwright <mail@wreathwright.example>`. */
  from: string
  to: string[]
  kind: string | null
  text: string
  html: string
  time: Date
}

interface MaildevMessage {
  id: string
  time: string
  subject: string
  from: { address: string; name: string }[]
  to: { address: string; name: string }[]
  headers: Record<string, string>
  text?: string
  html?: string
}

function catcherUrl(): string {
  const url = process.env.MAIL_CATCHER_URL
  if (!url) throw new Error('MAIL_CATCHER_URL is not set: run these tests through `npm test`')
  return url
}

/** Every message the catcher holds, oldest first. */
export async function caughtMails(): Promise<CaughtMail[]> {
  const response = await fetch(`${catcherUrl()}/api/email`)
  if (!response.ok) throw new Error(`mail catcher: HTTP ${response.status}`)
  const messages = (await response.json()) as MaildevMessage[]
  return messages
    .map((message) => ({
      id: message.id,
      subject: message.subject,
      from: message.from.map((sender) => (sender.name ? `${sender.name} <${sender.address}>` : sender.address)).join(', '),
      to: message.to.map((recipient) => recipient.address.toLowerCase()),
      kind: message.headers[KIND_HEADER.toLowerCase()] ?? null,
      text: message.text ?? '',
      html: message.html ?? '',
      time: new Date(message.time),
    }))
    .sort((a, b) => a.time.getTime() - b.time.getTime())
}

/** What to wait for: the recipient, and the kind (our header) or a subject (a string it contains, or a pattern). */
export interface MailQuery {
  to: string
  kind?: MailKind
  subject?: string | RegExp
}

function matches(mail: CaughtMail, query: MailQuery): boolean {
  if (!mail.to.includes(query.to.toLowerCase())) return false
  if (query.kind && mail.kind !== query.kind) return false
  if (typeof query.subject === 'string' && !mail.subject.includes(query.subject)) return false
  if (query.subject instanceof RegExp && !query.subject.test(mail.subject)) return false
  return true
}

/** The newest message matching `query`, waiting for it up to `timeoutMs`; throws when none comes. */
export async function waitForMail(query: MailQuery, timeoutMs = 15_000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const found = (await caughtMails()).filter((mail) => matches(mail, query)).at(-1)
    if (found) return found
    if (Date.now() > deadline) throw new Error(`no message ${JSON.stringify({ ...query, subject: query.subject?.toString() })} within ${timeoutMs} ms`)
    await new Promise((resolve) => setTimeout(resolve, 200))
  }
}

/**
 * The first link in a message whose path starts with `path` (from the HTML part's hrefs).
 *
 * @example firstLink({ html: '<a href="http://127.0.0.1:3000/reset-password?token=abc">Reset</a>' }, '/reset-password') // 'http://127.0.0.1:3000/reset-password?token=abc'
 */
export function firstLink(mail: Pick<CaughtMail, 'html'>, path: string): string {
  for (const [, href] of mail.html.matchAll(/href="([^"]+)"/g)) {
    const url = href!.replaceAll('&amp;', '&')
    if (URL.canParse(url) && new URL(url).pathname.startsWith(path)) return url
  }
  throw new Error(`no link to ${path} in the message`)
}

/** Empties the catcher (between tests that look for "no message"). */
export async function clearMails(): Promise<void> {
  const response = await fetch(`${catcherUrl()}/api/email/all`, { method: 'DELETE' })
  if (!response.ok) throw new Error(`mail catcher: HTTP ${response.status}`)
}

/**
 * Runs a mail worker in this test process for the file's tests (the app does so in its own
 * process): started before the first test, stopped with the queue after the last.
 */
export function useMailWorker(): void {
  beforeAll(async () => {
    await startMailWorker()
  })
  afterAll(async () => {
    await stopMailWorker()
    await closeQueueSender()
  })
}

/**
 * Forgets every message still waiting in the queue (freshDatabase empties the mail log but not
 * pg-boss's tables), so a worker started later does not send another test's messages.
 */
export async function clearMailQueue(): Promise<void> {
  const [row] = await database().query<{ present: boolean }>('SELECT to_regclass(:table) IS NOT NULL AS present', {
    replacements: { table: `${QUEUE_SCHEMA}.job` },
    type: QueryTypes.SELECT,
  })
  if (row?.present) await database().query(`DELETE FROM ${QUEUE_SCHEMA}.job WHERE name = 'mail'`)
}
