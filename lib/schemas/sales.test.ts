import { describe, expect, it } from 'vitest'
import { readSalesQuery } from './sales'

describe('the sales table’s query string', () => {
  it('reads days and a pattern, and treats empty fields as absent', () => {
    expect(readSalesQuery(new URLSearchParams('from=2026-03-01&to=2026-03-31&patternId='))).toEqual({ ok: true, query: { from: '2026-03-01', to: '2026-03-31' } })
    expect(readSalesQuery({})).toEqual({ ok: true, query: {} })
  })

  it('refuses a day that is not on the calendar, once per parameter', () => {
    // 2026 is not a leap year (Gregorian rule: divisible by 4, not by 100 unless by 400), so no 29 February.
    for (const day of ['2026-02-29', '2026-02-30', '2026-13-01', '26-03-01', 'yesterday']) {
      expect(readSalesQuery({ from: day }), day).toEqual({ ok: false, issues: [{ path: 'from', message: 'A day is written YYYY-MM-DD.' }] })
    }
    expect(readSalesQuery({ from: '2028-02-29' }).ok).toBe(true)
  })

  it('names an unknown parameter and a last day before the first', () => {
    expect(readSalesQuery({ buyer: 'x' })).toEqual({ ok: false, issues: [{ path: 'buyer', message: 'The sales table has no filter called “buyer”.' }] })
    expect(readSalesQuery({ from: '2026-03-02', to: '2026-03-01' })).toEqual({ ok: false, issues: [{ path: 'to', message: 'The last day must not be before the first.' }] })
    expect(readSalesQuery({ patternId: 'not-an-id' })).toEqual({ ok: false, issues: [{ path: 'patternId', message: 'No such pattern.' }] })
  })
})
