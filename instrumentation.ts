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
  const { runMailWorkerInThisProcess } = await import('@/lib/mail/worker')
  runMailWorkerInThisProcess()
}
