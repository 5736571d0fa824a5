'use client'

/**
 * What an error page says (app/global-error.tsx, app/error.tsx): that the page failed, Next.js's
 * reference of the error in the server's log, and the two ways on.
 *
 * @example <ErrorNotice digest={error.digest} reset={reset} />
 */
export function ErrorNotice({ digest, reset }: { digest: string | undefined; reset: () => void }) {
  return (
    <article className="mx-auto max-w-2xl space-y-4" data-testid="error-page">
      <h1 className="text-2xl font-semibold text-thread-800">Something went wrong</h1>
      <p className="text-stone-700">
        Wreathwright could not show this page. Nothing you saved is lost. Try again in a moment; if it keeps happening, tell
        us the reference below.
      </p>
      {digest && (
        <p className="text-sm text-stone-600">
          Reference: <code data-testid="error-digest">{digest}</code>
        </p>
      )}
      <p className="flex gap-4">
        <button type="button" onClick={reset} className="rounded bg-thread-700 px-4 py-2 text-white hover:bg-thread-800">
          Try again
        </button>
        {/* A plain link, not next/link: the client router may be what failed. */}
        {/* eslint-disable-next-line @next/next/no-html-link-for-pages -- a full page load, on purpose */}
        <a href="/" className="self-center text-thread-700 hover:underline">
          Go to the start page
        </a>
      </p>
    </article>
  )
}
