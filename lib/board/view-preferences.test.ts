import { describe, expect, it } from 'vitest'
import { readViewPreferences, writeViewPreferences } from './view-preferences'

const memoryStorage = () => {
  const items = new Map<string, string>()
  return { getItem: (k: string) => items.get(k) ?? null, setItem: (k: string, v: string) => void items.set(k, v), items }
}

describe('view preferences', () => {
  it('brings back the side and colourway a pattern was left on', () => {
    const storage = memoryStorage()
    writeViewPreferences(storage, 'p1', { view: { zoom: 30, centre: [0, 0], side: 'printed' }, activeColorway: 'Frost' })
    expect(readViewPreferences(storage, 'p1')).toEqual({ side: 'printed', colorway: 'Frost' })
    expect(readViewPreferences(storage, 'p2')).toBeNull()
  })

  it('ignores anything it did not write', () => {
    const storage = memoryStorage()
    storage.setItem('wreathwright:view:p1', '{"side":"sideways"}')
    expect(readViewPreferences(storage, 'p1')).toBeNull()
    storage.setItem('wreathwright:view:p1', 'not json')
    expect(readViewPreferences(storage, 'p1')).toBeNull()
    expect(readViewPreferences(null, 'p1')).toBeNull()
  })
})
