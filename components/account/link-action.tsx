'use client'

import Link from 'next/link'
import { useEffect, useRef, useState } from 'react'
import { ApiError, apiFetch } from '@/lib/api-client'
import { safeRedirectPath } from '@/lib/safe-redirect'
import { useLinkToken } from './link-token'

type State = { readonly step: 'working' } | { readonly step: 'done'; readonly next?: string } | { readonly step: 'failed'; readonly message: string }

/**
 * A page an e-mail link opens that acts at once (confirming an address): posts the link's token
 * to `url` and shows the outcome. `retry` says where to ask for a new link.
 */
export function LinkAction({
  url,
  done,
  retry,
}: {
  url: string
  done: { readonly message: string; readonly href: string; readonly label: string }
  retry: { readonly href: string; readonly label: string }
}) {
  const token = useLinkToken()
  const [state, setState] = useState<State>({ step: 'working' })
  const posted = useRef(false)

  useEffect(() => {
    if (token === undefined || posted.current) return
    posted.current = true
    const post = async (): Promise<State> => {
      if (!token) return { step: 'failed', message: 'This link carries no token. Open the link from the e-mail again.' }
      try {
        const answer = await apiFetch(url, { method: 'POST', json: { token } })
        // An answer may name where to go next (a tester invitation claimed on confirming the address).
        const next = typeof answer === 'object' && answer !== null && 'next' in answer ? safeRedirectPath(answer.next, '') : ''
        return next ? { step: 'done', next } : { step: 'done' }
      } catch (error) {
        return { step: 'failed', message: error instanceof ApiError ? error.message : 'Could not reach Wreathwright. Check your connection and try again.' }
      }
    }
    void post().then(setState)
  }, [token, url])

  if (state.step === 'working') return <p role="status">Checking the link…</p>
  if (state.step === 'done') {
    return (
      <div role="status" className="flex flex-col gap-4">
        <p className="text-stone-700">{done.message}</p>
        <Link href={state.next ?? done.href} className="self-start rounded bg-thread-700 px-4 py-2 font-medium text-white hover:bg-thread-800">
          {state.next ? 'Open the pattern you were invited to test' : done.label}
        </Link>
      </div>
    )
  }
  return (
    <div className="flex flex-col gap-4">
      <p role="alert" className="text-madder-700">
        {state.message}
      </p>
      <Link href={retry.href} className="text-thread-700 underline">
        {retry.label}
      </Link>
    </div>
  )
}
