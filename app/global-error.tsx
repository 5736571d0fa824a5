'use client'

import { ErrorNotice } from '@/components/ui/error-notice'
import './globals.css'

/**
 * What a visitor sees when the site itself fails to render (the root layout included), in place
 * of Next.js's built-in page, which carries its own inline `<style>` element without the page's
 * nonce: the Content-Security-Policy (lib/security-headers.ts) refuses it, so that page showed
 * unstyled and logged a refusal. This one is styled by the site's own stylesheet only. It stands
 * outside the root layout, so it brings its own `<html>` and `<body>` (Next.js's rule for this
 * file); an error below the layout shows app/error.tsx instead, inside the site.
 */
export default function GlobalError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <html lang="en">
      <body className="min-h-screen font-sans">
        <title>Something went wrong · Wreathwright</title>
        <main className="px-4 py-6">
          <ErrorNotice digest={error.digest} reset={reset} />
        </main>
      </body>
    </html>
  )
}
