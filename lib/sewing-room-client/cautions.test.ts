import { describe, expect, it } from 'vitest'
import { cautionsFor } from './cautions'

describe('cautionsFor', () => {
  it('puts each caution by the work it is about', () => {
    const ids = (group: string) => cautionsFor(group).map((caution) => caution.id)
    expect(ids('cut')).toEqual(['rotary-cutter'])
    expect(ids('prepare-leaves')).toEqual(['hot-iron'])
    expect(ids('repeat-4')).toEqual(['hot-iron'])
    expect(ids('join-repeats')).toEqual(['hot-iron'])
    expect(ids('finishing')).toEqual(['hot-iron', 'small-parts'])
    expect(ids('something-new')).toEqual([])
  })

  it('says small parts are not for infants and leaves the choice to the maker', () => {
    const smallParts = cautionsFor('finishing')[1]!
    expect(smallParts.text).toMatch(/not meant for infants/)
    expect(smallParts.text).toMatch(/where you judge it wise/)
  })
})
