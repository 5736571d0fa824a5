import 'server-only'
import { authorize, type Actor } from '@/lib/authorization'
import { database } from '@/lib/db'
import { ADMIN_PAGE_SIZE, type PageQuery } from '@/lib/schemas/admin'
import { PaymentEvent } from '@/models'
import type { PaymentEventState } from '@/models/payment-event'

/** One webhook call in the admin's payment log: never its payload (it names buyers). */
export interface PaymentLogRow {
  id: string
  receivedAt: string
  state: PaymentEventState
  type: string | null
  providerEventId: string | null
  note: string | null
  attempts: number
  processedAt: string | null
}

/**
 * The payment log, newest first (`GET /api/admin/payments?page=`): every webhook call, verified or
 * refused, and what processing made of it. Admins only (404 for others, as the whole desk).
 */
export async function listPaymentEvents(actor: Actor, query: PageQuery) {
  authorize(actor, 'read-payment-log')
  database()
  const { rows, count } = await PaymentEvent.findAndCountAll({
    attributes: ['id', 'receivedAt', 'state', 'type', 'providerEventId', 'note', 'attempts', 'processedAt'],
    order: [['receivedAt', 'DESC'], ['id', 'DESC']],
    limit: ADMIN_PAGE_SIZE,
    offset: (query.page - 1) * ADMIN_PAGE_SIZE,
  })
  const events: PaymentLogRow[] = rows.map((row) => ({
    id: String(row.id),
    receivedAt: row.receivedAt.toISOString(),
    state: row.state,
    type: row.type,
    providerEventId: row.providerEventId,
    note: row.note,
    attempts: row.attempts,
    processedAt: row.processedAt?.toISOString() ?? null,
  }))
  return { rows: events, page: query.page, pageSize: ADMIN_PAGE_SIZE, total: count, pageCount: Math.max(1, Math.ceil(count / ADMIN_PAGE_SIZE)) }
}
