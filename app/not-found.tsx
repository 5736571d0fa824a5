import type { Metadata } from 'next'
import Link from 'next/link'

export const metadata: Metadata = { title: 'Not found' }

/**
 * What every unknown address and every `notFound()` shows (a pattern you may not see answers
 * exactly like a missing one), inside the site's layout.
 *
 * It also replaces Next.js's built-in not-found page, which carries its own inline `<style>`
 * element without the page's nonce: the Content-Security-Policy (lib/security-headers.ts) refuses
 * it, in the served HTML and again when React renders it in the browser.
 */
export default function NotFound() {
  return (
    <article className="mx-auto max-w-2xl space-y-4" data-testid="not-found">
      <h1 className="text-2xl font-semibold text-thread-800">Nothing here</h1>
      <p className="text-stone-700">
        This page does not exist, or it is not yours to see. If someone sent you a link, check that you are signed in
        with the address it was sent to.
      </p>
      <p>
        <Link href="/" className="text-thread-700 hover:underline">
          Go to the start page
        </Link>
      </p>
    </article>
  )
}
