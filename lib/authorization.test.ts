import { describe, expect, it } from 'vitest'
import { authorize, can, type Actor } from './authorization'
import { ForbiddenError, NotFoundError, UnauthenticatedError } from './errors'

const person = (roles: NonNullable<Actor>['roles'], id = 'person-1'): Actor => ({ id, roles })
const patternOf = (ownerId: string) => ({ ownerId, state: 'draft' as const })

describe('can', () => {
  it('lets designers and admins create patterns, nobody else', () => {
    expect(can(person(['designer']), 'create-pattern')).toBe(true)
    expect(can(person(['admin']), 'create-pattern')).toBe(true)
    expect(can(person(['quilter']), 'create-pattern')).toBe(false)
    expect(can(person(['tester', 'quilter']), 'create-pattern')).toBe(false)
    expect(can(null, 'create-pattern')).toBe(false)
  })

  it("keeps a designer to their own patterns, lets an admin into anyone's", () => {
    const mine = patternOf('person-1')
    const theirs = patternOf('person-2')
    for (const action of ['read-pattern', 'update-pattern', 'delete-pattern', 'change-pattern-state'] as const) {
      expect(can(person(['designer']), action, mine)).toBe(true)
      expect(can(person(['designer']), action, theirs)).toBe(false)
      expect(can(person(['admin'], 'admin-1'), action, theirs)).toBe(true)
    }
  })

  it('does not let a former designer change a pattern they still own', () => {
    expect(can(person(['quilter']), 'update-pattern', patternOf('person-1'))).toBe(false)
    expect(can(person(['quilter']), 'read-pattern', patternOf('person-1'))).toBe(true)
  })
})

describe('testers and licence holders', () => {
  const testing = { ownerId: 'designer-1', state: 'testing' as const, testerIds: ['tester-1'] }
  const tester = person(['quilter'], 'tester-1')

  it('lets a tester read and print the pattern while it is in testing, nothing more', () => {
    expect(can(tester, 'read-pattern', testing)).toBe(true)
    expect(can(tester, 'print-pattern', testing)).toBe(true)
    expect(can(tester, 'test-pattern', testing)).toBe(true)
    for (const action of ['update-pattern', 'delete-pattern', 'change-pattern-state', 'invite-testers'] as const) {
      expect(can(tester, action, testing)).toBe(false)
    }
  })

  it.each(['draft', 'published', 'retired'] as const)('closes a %s pattern to its testers', (state) => {
    expect(can(tester, 'read-pattern', { ...testing, state })).toBe(false)
    expect(can(tester, 'print-pattern', { ...testing, state })).toBe(false)
  })

  it('gives nothing to someone not listed, or when the testers were not looked up', () => {
    expect(can(person(['quilter'], 'tester-2'), 'read-pattern', testing)).toBe(false)
    expect(can(tester, 'read-pattern', { ownerId: 'designer-1', state: 'testing' })).toBe(false)
  })

  it('lets a licence holder read and print a published or retired pattern, not a draft', () => {
    const buyer = person(['quilter'], 'buyer-1')
    for (const state of ['published', 'retired'] as const) {
      expect(can(buyer, 'print-pattern', { ownerId: 'designer-1', state, licenceHolderIds: ['buyer-1'] })).toBe(true)
    }
    expect(can(buyer, 'read-pattern', { ownerId: 'designer-1', state: 'draft', licenceHolderIds: ['buyer-1'] })).toBe(false)
  })

  it("shows a pattern's swatches to its testers only while it is in testing", () => {
    const upload = { ownerId: 'designer-1', designPatterns: [testing] }
    expect(can(tester, 'read-upload', upload)).toBe(true)
    expect(can(person(['quilter'], 'tester-2'), 'read-upload', upload)).toBe(false)
    expect(can(tester, 'read-upload', { ownerId: 'designer-1', designPatterns: [{ ...testing, state: 'published' as const }] })).toBe(false)
  })

  it('lets only the owning designer or an admin invite testers', () => {
    expect(can(person(['designer'], 'designer-1'), 'invite-testers', testing)).toBe(true)
    expect(can(person(['admin'], 'admin-1'), 'invite-testers', testing)).toBe(true)
    expect(can(person(['designer'], 'designer-2'), 'invite-testers', testing)).toBe(false)
  })
})

describe('authorize', () => {
  it('asks who is there first, then hides unreadable patterns as missing, then forbids', () => {
    expect(() => authorize(null, 'create-pattern')).toThrow(UnauthenticatedError)
    expect(() => authorize(person(['designer']), 'read-pattern', patternOf('person-2'))).toThrow(NotFoundError)
    expect(() => authorize(person(['quilter']), 'create-pattern')).toThrow(ForbiddenError)
    expect(() => authorize(person(['designer']), 'create-pattern')).not.toThrow()
  })
})

describe('uploads', () => {
  it('lets designers and admins upload theme-fabric photos and swatches, nobody else', () => {
    expect(can(person(['designer']), 'upload-image', 'fabric-photo')).toBe(true)
    expect(can(person(['admin']), 'upload-image', 'swatch')).toBe(true)
    expect(can(person(['quilter']), 'upload-image', 'fabric-photo')).toBe(false)
    expect(can(null, 'upload-image', 'fabric-photo')).toBe(false)
  })

  it('shows an upload to its owner and admins only; to anyone else it is missing', () => {
    const upload = { ownerId: 'person-1' }
    expect(can(person(['designer']), 'read-upload', upload)).toBe(true)
    expect(can(person(['admin'], 'admin-1'), 'read-upload', upload)).toBe(true)
    expect(can(person(['designer'], 'person-2'), 'read-upload', upload)).toBe(false)
    expect(() => authorize(person(['designer'], 'person-2'), 'read-upload', upload)).toThrow(NotFoundError)
    expect(() => authorize(null, 'read-upload', upload)).toThrow(UnauthenticatedError)
  })
})

describe('test reports', () => {
  const testing = { ownerId: 'designer-1', state: 'testing' as const, testerIds: ['tester-1'] }
  const designer = person(['designer', 'quilter'], 'designer-1')
  const tester = person(['quilter'], 'tester-1')
  const other = person(['quilter'], 'tester-2')
  const admin = person(['admin'], 'admin-1')

  it('lets only the testers of a pattern in testing file reports', () => {
    expect(can(tester, 'file-report', testing)).toBe(true)
    expect(can(designer, 'file-report', testing)).toBe(false)
    expect(can(admin, 'file-report', testing)).toBe(false)
    expect(can(other, 'file-report', testing)).toBe(false)
    expect(can(tester, 'file-report', { ...testing, state: 'draft' })).toBe(false)
  })

  it('lets the designer, the testers and admins read and answer; only the designer or an admin resolves', () => {
    for (const action of ['read-reports', 'answer-report'] as const) {
      for (const reader of [designer, tester, admin]) expect(can(reader, action, testing)).toBe(true)
      expect(can(other, action, testing)).toBe(false)
    }
    expect(can(designer, 'change-report-state', testing)).toBe(true)
    expect(can(admin, 'change-report-state', testing)).toBe(true)
    expect(can(tester, 'change-report-state', testing)).toBe(false)
  })

  it('lets anyone signed in upload a report photo, shown besides its owner to the designer and testers of the patterns whose reports show it', () => {
    expect(can(person(['quilter']), 'upload-image', 'report-photo')).toBe(true)
    expect(can(null, 'upload-image', 'report-photo')).toBe(false)
    const photo = { ownerId: 'tester-1', reportPatterns: [testing] }
    for (const reader of [tester, designer, admin]) expect(can(reader, 'read-upload', photo)).toBe(true)
    expect(can(other, 'read-upload', photo)).toBe(false)
    // Not yet on a report: its owner's alone (and admins').
    expect(can(designer, 'read-upload', { ownerId: 'tester-1' })).toBe(false)
  })
})

describe('the admin desk', () => {
  const deskActions = ['manage-users', 'decide-designer-requests', 'read-audit-log', 'read-mail-log'] as const

  it('is for admins only', () => {
    for (const action of deskActions) {
      expect(can(person(['admin']), action), action).toBe(true)
      for (const roles of [['designer', 'quilter'], ['tester', 'quilter'], ['quilter'], []] as const) {
        expect(can(person([...roles]), action), `${action} as ${roles.join('+')}`).toBe(false)
      }
      expect(can(null, action)).toBe(false)
    }
  })

  it('is not even found by others: 404 for the signed in, 401 for strangers', () => {
    for (const action of deskActions) {
      expect(() => authorize(person(['designer', 'quilter']), action)).toThrow(NotFoundError)
      expect(() => authorize(null, action)).toThrow(UnauthenticatedError)
      expect(() => authorize(person(['admin']), action)).not.toThrow()
    }
  })
})
