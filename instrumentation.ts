/**
 * Runs once when the server starts (Next.js instrumentation hook), before it handles requests —
 * in `next start` on the first one, whose address may therefore be missed (it then counts as
 * unknown; see lib/client-address.ts).
 *
 * It starts listening for changed rows (lib/row-changes.ts), which lets this instance keep the
 * answers it read until they change.
 *
 * It also starts this instance's background workers (lib/jobs/worker.ts): the mail worker, which
 * sends queued messages (unless MAIL_WORKER=off), and the payment worker, which applies verified
 * payment events (unless PAYMENTS_WORKER=off). Every instance may run them: they share the queues.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  const { stampPeerAddresses } = await import('@/lib/peer-address-stamp')
  stampPeerAddresses()
  // `next build` may load this file to collect pages: no worker there.
  if (process.env.NEXT_PHASE === 'phase-production-build') return
  // Hear which rows change, so that this instance may keep sessions, patterns and sewing plans (lib/row-changes.ts).
  const [{ rowChanges }, { serverEnv }] = await Promise.all([import('@/lib/row-changes'), import('@/lib/env')])
  rowChanges().start(serverEnv().DATABASE_URL)
  const { runJobWorkersInThisProcess } = await import('@/lib/jobs/worker')
  runJobWorkersInThisProcess()
}
