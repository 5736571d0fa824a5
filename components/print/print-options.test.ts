import { describe, expect, it } from 'vitest'
import { bookletFileName, printOptionsFrom, type PrintFormState } from './print-options'

const form = (overrides: Partial<PrintFormState> = {}): PrintFormState => ({
  paper: 'letter', orientation: 'portrait', colorway: 'Holly', diameter: '24', units: 'in',
  parts: ['cover', 'foundations'], margin: '0.4', overlap: '0.5', ...overrides,
})

describe('print dialog options', () => {
  it('turns the form into the shared booklet options', () => {
    const result = printOptionsFrom(form())
    expect(result).toEqual({ ok: true, options: expect.objectContaining({ paper: 'letter', finishedDiameterInches: 24, parts: ['cover', 'foundations'], marginInches: 0.4, overlapInches: 0.5 }) })
  })

  it('reads a centimetre diameter as inches (1 in = 2.54 cm exactly)', () => {
    const result = printOptionsFrom(form({ diameter: '60.96', units: 'cm' }))
    expect(result.ok && result.options.finishedDiameterInches).toBeCloseTo(24, 9)
  })

  it('names the problem in words', () => {
    expect(printOptionsFrom(form({ diameter: 'abc' }))).toEqual({ ok: false, message: 'The finished diameter must be a positive number.' })
    expect(printOptionsFrom(form({ parts: [] }))).toEqual({ ok: false, message: 'Choose at least one part of the booklet.' })
    expect(printOptionsFrom(form({ overlap: '0.1' }))).toEqual({ ok: false, message: 'The overlap must be between 0.25 and 2 in.' })
  })

  it('names the file after pattern, colourway, size and paper', () => {
    expect(bookletFileName('Hollyberry Wreath', { paper: 'a4', colorway: 'Frost', finishedDiameterInches: 24 })).toBe('hollyberry-wreath-frost-24in-a4.pdf')
  })
})
