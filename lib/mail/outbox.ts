import 'server-only'
import type { Transaction } from 'sequelize'
import { database } from '@/lib/db'
import { OutgoingMail } from '@/models'
import { MAIL_KINDS, MAIL_QUEUE, type MailData, type MailJob, type MailKind } from './kinds'
import { senderFor, sendInTransaction } from '@/lib/jobs/boss'
import { ensureMailQueue } from './queue'

/**
 * Queues a message: a row in the mail log (`outgoing_mails`) and a job on the durable queue, both
 * in the caller's transaction when one is given. A rolled-back transaction therefore sends nothing,
 * and once it commits the message survives a crash until the worker (lib/mail/worker.ts) sends it.
 * Never waits for SMTP.
 *
 * @example
 * await queueMail({ to: 'ada@example.com', kind: 'password-changed', data: { displayName: 'Ada' }, userId: ada.id }, { transaction })
 */
export async function queueMail<K extends MailKind>(
  message: { to: string; kind: K; data: MailData[K]; userId?: string | null },
  options?: { transaction?: Transaction },
): Promise<void> {
  if (!(MAIL_KINDS as readonly string[]).includes(message.kind)) throw new Error(`queueMail: unknown kind ${message.kind}`)
  // Binds this bundle's copy of the models to the shared connection (see lib/db.ts).
  const sequelize = database()
  const boss = await senderFor('mail', (sender) => ensureMailQueue(sender))
  const write = async (transaction: Transaction) => {
    const row = await OutgoingMail.create({ toAddress: message.to, kind: message.kind, userId: message.userId ?? null }, { transaction })
    const job: MailJob<K> = { mailId: row.id, to: message.to, kind: message.kind, data: message.data }
    await sendInTransaction(boss, MAIL_QUEUE, job, transaction)
  }
  if (options?.transaction) await write(options.transaction)
  else await sequelize.transaction(write)
}
