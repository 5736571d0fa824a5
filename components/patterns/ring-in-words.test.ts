import { describe, expect, it } from 'vitest'
import { ringInWords } from './ring-in-words'

describe('ringInWords', () => {
  it('says the repeats, the diameter to the nearest 1/8 in and the seams', () => {
    expect(ringInWords({ repeats: 4, outerDiameterInches: 18, seamCount: 24 })).toBe('4 repeats · 18 in across · 24 seams')
    // 45.72 cm = 18 in exactly (1 in = 2.54 cm, 1959 agreement); 18.3 in reads as 18 1/4 in
    expect(ringInWords({ repeats: 6, outerDiameterInches: 18.3, seamCount: 1 })).toBe('6 repeats · 18 1/4 in across · 1 seam')
  })

  it('shows a dash for a design that could not be summarised', () => {
    expect(ringInWords({ repeats: 0, outerDiameterInches: 0, seamCount: 0 })).toBe('—')
  })
})
