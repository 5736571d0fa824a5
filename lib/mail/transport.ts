import nodemailer, { type Transporter } from 'nodemailer'
import type { MailSettings } from '@/lib/env'

type SmtpSettings = NonNullable<MailSettings['smtp']>

/**
 * The nodemailer transport to the configured SMTP server (in the demo and the tests, the local
 * mail catcher). Short timeouts: a failed try is retried by the queue, not by waiting here.
 */
export function createTransport(smtp: SmtpSettings): Transporter {
  return nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    auth: smtp.auth ? { user: smtp.auth.user, pass: smtp.auth.pass } : undefined,
    connectionTimeout: 10_000,
    greetingTimeout: 10_000,
    socketTimeout: 30_000,
    // nodemailer logs nothing unless asked; keep it so (its debug log would print the message).
    logger: false,
    debug: false,
  })
}
