'use client'

import { ErrorNotice } from '@/components/ui/error-notice'

/**
 * What a page that failed to render shows, inside the site's layout (its header stays), in place
 * of Next.js's built-in error page and its inline style without the page's nonce (see
 * app/global-error.tsx, which covers a failure of the layout itself).
 */
export default function PageError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return <ErrorNotice digest={error.digest} reset={reset} />
}
