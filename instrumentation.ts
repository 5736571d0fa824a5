/**
 * Runs once when the server starts (Next.js instrumentation hook), before it handles requests —
 * in `next start` on the first one, whose address may therefore be missed (it then counts as
 * unknown; see lib/client-address.ts).
 *
 * It also starts this instance's mail worker (lib/mail/worker.ts), which sends queued messages in
 * the background, unless MAIL_WORKER=off. Every instance may run one: they share the queue.
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  const { stampPeerAddresses } = await import('@/lib/peer-address-stamp')
  stampPeerAddresses()
  // `next build` may load this file to collect pages: no worker there.
  if (process.env.NEXT_PHASE === 'phase-production-build' || process.env.MAIL_WORKER === 'off') return
  const { startMailWorker, stopMailWorker } = await import('@/lib/mail/worker')
  // A database that is not up yet is no reason to refuse requests: the worker says why and the
  // messages wait in the queue for the next start.
  startMailWorker().catch((error: Error) => console.error(`mail: the worker did not start: ${error.message}`))
  // Let a message being sent finish before the process ends (pg-boss then closes its pool).
  for (const signal of ['SIGTERM', 'SIGINT'] as const) {
    process.once(signal, () => void stopMailWorker().finally(() => process.exit(0)))
  }
}
