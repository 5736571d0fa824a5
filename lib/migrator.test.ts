import { describe, expect, it } from 'vitest'
import { migrationLine } from './migrator'

describe('migrationLine', () => {
  it('prints one line per migration run, with its time in seconds', () => {
    expect(migrationLine({ event: 'migrated', name: '20261202-0001-create-users-and-sessions.ts', durationSeconds: 0.031 }))
      .toBe('migrated 20261202-0001-create-users-and-sessions.ts (0.03 s)')
    expect(migrationLine({ event: 'reverted', name: '20261202-0003-let-revisions-forget-a-deleted-user.ts', durationSeconds: 1.2 }))
      .toBe('reverted 20261202-0003-let-revisions-forget-a-deleted-user.ts (1.20 s)')
  })

  it('prints nothing when a migration starts, so each one is a single line', () => {
    expect(migrationLine({ event: 'migrating', name: '20261202-0001-create-users-and-sessions.ts' })).toBeNull()
    expect(migrationLine({ event: 'reverting', name: '20261202-0001-create-users-and-sessions.ts' })).toBeNull()
  })

  it('never prints an object as [object Object]', () => {
    expect(migrationLine({ event: 'created', path: 'migrations/x.ts' })).toBe('{"event":"created","path":"migrations/x.ts"}')
  })
})
