import { describe, expect, it } from 'vitest'
import { selectsEndToEndTests } from './test-selection'

describe('selectsEndToEndTests (whether npm test builds the app)', () => {
  it('says no for a filter that selects integration tests alone, so the build is skipped', () => {
    expect(selectsEndToEndTests(['tests/integration/database-restart'])).toBe(false)
    expect(selectsEndToEndTests(['tests/integration/'])).toBe(false)
  })

  it('says yes when an end-to-end test matches, among other filters or alone, and without filters', () => {
    expect(selectsEndToEndTests(['tests/integration/mail', 'tests/e2e/scale-out'])).toBe(true)
    // A bare word matches in both folders (tests/integration/sewing-room…, tests/e2e/sewing-room…).
    expect(selectsEndToEndTests(['sewing-room'])).toBe(true)
    expect(selectsEndToEndTests([])).toBe(true)
  })
})
