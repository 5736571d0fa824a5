import { randomUUID } from 'node:crypto'
import { lucia } from '@/lib/auth/lucia'
import { hashPassword } from '@/lib/auth/password'
import { database } from '@/lib/db'
import type { Role } from '@/lib/roles'
import type { DesignFile } from '@/lib/schemas/design'
import { emptyDesign } from '@/lib/new-design'
import { Pattern, PatternRevision, User } from '@/models'

export const TEST_PASSWORD = 'a-long-test-password'
let cachedHash: Promise<string> | undefined

/** A user with a known password; pass overrides for roles, e-mail or name. */
export async function createUser(overrides: Partial<{ email: string; displayName: string; roles: Role[] }> = {}) {
  database()
  cachedHash ??= hashPassword(TEST_PASSWORD)
  return User.create({
    email: overrides.email ?? `person-${randomUUID()}@example.test`,
    displayName: overrides.displayName ?? 'Test Person',
    passwordHash: await cachedHash,
    roles: overrides.roles ?? ['quilter'],
    emailVerifiedAt: null,
    designerRequestedAt: null,
  })
}

/** The Cookie header of a fresh session for this user. */
export async function sessionCookieFor(user: { id: string }): Promise<string> {
  const session = await lucia().createSession(user.id, {})
  return `${lucia().sessionCookieName}=${session.id}`
}

/** A pattern owned by `owner`, with its first revision, as a designer would have saved it. */
export async function createPatternRow(owner: { id: string }, overrides: Partial<{ name: string; state: Pattern['state']; design: DesignFile }> = {}) {
  database()
  const name = overrides.name ?? 'Test ring'
  const design = overrides.design ?? emptyDesign(name)
  const pattern = await Pattern.create({ ownerId: owner.id, name, state: overrides.state ?? 'draft', design })
  await PatternRevision.create({ patternId: pattern.id, revision: 1, name, state: pattern.state, design, savedById: owner.id })
  return pattern
}
