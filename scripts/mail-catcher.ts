/**
 * The local mail catcher the demo and the tests start: maildev, an SMTP server that keeps every
 * message it gets and shows them in a web view (and a JSON API, `GET /api/email`), both on loopback
 * only. The app sends to it through nodemailer with the settings `env` returns, as it would to a
 * real SMTP server; nothing it catches leaves the machine.
 */
import fs from 'node:fs'
import { MailDev } from 'maildev'

export interface MailCatcher {
  /** The web view (and its API under /api). */
  readonly url: string
  readonly smtpPort: number
  /** The app's settings for this catcher (lib/env.ts). */
  readonly env: Record<string, string>
  stop(): Promise<void>
}

/** Starts the catcher: SMTP on 127.0.0.1:`smtpPort`, its web view on 127.0.0.1:`webPort`, messages kept in `folder`. */
export async function startMailCatcher(folder: string, webPort: number, smtpPort: number): Promise<MailCatcher> {
  fs.mkdirSync(folder, { recursive: true, mode: 0o700 })
  const catcher = new MailDev({ smtp: smtpPort, web: webPort, ip: '127.0.0.1', webIp: '127.0.0.1', mailDirectory: folder, silent: true })
  // maildev's API prints "MailDev API running at …" even when silent; the demo prints its own line.
  const info = console.info
  console.info = () => undefined
  try {
    await catcher.start()
  } finally {
    console.info = info
  }
  const url = `http://127.0.0.1:${webPort}`
  return {
    url,
    smtpPort,
    env: { SMTP_HOST: '127.0.0.1', SMTP_PORT: String(smtpPort), MAIL_VIEW_URL: url },
    stop: () => catcher.stop(),
  }
}
