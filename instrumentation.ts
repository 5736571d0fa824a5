/**
 * Runs once when the server starts (Next.js instrumentation hook), before it handles requests —
 * in `next start` on the first one, whose address may therefore be missed (it then counts as
 * unknown; see lib/client-address.ts).
 */
export async function register(): Promise<void> {
  if (process.env.NEXT_RUNTIME !== 'nodejs') return
  const { stampPeerAddresses } = await import('@/lib/peer-address-stamp')
  stampPeerAddresses()
}
