import { describe, expect, it } from 'vitest'
import { footerLine } from '@/lib/booklet/chrome'
import { buyerFooter } from './footer'

describe("the buyer's footer", () => {
  it('says the licence, personal use and no resale or sharing, then the name, on the narrowest paper', () => {
    const footer = buyerFooter('Elsie Varga', 'WL-001001', { paper: 'a4', orientation: 'portrait', marginInches: 0.4 })
    expect(footerLine(footer)).toBe('Licence WL-001001 – for personal use, not for resale or sharing · Elsie Varga')
  })

  it('shortens the wording, never the name or the number, for a long name', () => {
    const name = 'Philippa Constance Arbuthnot-Wolstenholme'
    const footer = buyerFooter(name, 'WL-001001', { paper: 'a4', orientation: 'portrait', marginInches: 0.4 })
    expect(footer.person).toBe(name)
    expect(footer.notice.startsWith('Licence WL-001001')).toBe(true)
    expect(footer.notice).not.toContain('not for resale or sharing')
  })
})
