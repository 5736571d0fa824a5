import { UAParser } from 'ua-parser-js'

/**
 * A session's device in a few words, from the browser's User-Agent header (ua-parser-js), for the
 * account page's list of sessions.
 *
 * @example describeDevice('Mozilla/5.0 (X11; Linux x86_64) AppleWebKit/537.36 (KHTML, like Gecko) Chrome/120.0.0.0 Safari/537.36') // 'Chrome 120 on Linux'
 */
export function describeDevice(userAgent: string | null | undefined): string {
  if (!userAgent) return 'An unknown browser'
  const { browser, os, device } = UAParser(userAgent)
  const browserName = browser.name ? [browser.name, browser.major].filter(Boolean).join(' ') : 'An unknown browser'
  const system = [os.name, device.type === 'mobile' || device.type === 'tablet' ? device.model : undefined].filter(Boolean).join(', ')
  return system ? `${browserName} on ${system}` : browserName
}
