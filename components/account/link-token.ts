'use client'

import { useEffect, useState } from 'react'

/**
 * The token of an e-mail link, read from the fragment (`#token=…`; lib/services/accounts.ts puts
 * it there so it never reaches a server log) and then removed from the address bar.
 * `undefined` until the page has read it, `null` when the link carried none.
 */
export function useLinkToken(): string | null | undefined {
  const [token, setToken] = useState<string | null | undefined>(undefined)
  useEffect(() => {
    const found = new URLSearchParams(window.location.hash.slice(1)).get('token')
    if (found) window.history.replaceState(null, '', window.location.pathname + window.location.search)
    // Read once after mounting: the fragment exists only in the browser.
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the browser's address is outside React
    setToken(found)
  }, [])
  return token
}
