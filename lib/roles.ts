/** What a person may do is decided by lib/authorization.ts; these are the roles it knows. */
export const ROLES = ['designer', 'tester', 'quilter', 'admin'] as const
export type Role = (typeof ROLES)[number]

/**
 * Roles a new account gets: everyone quilts. A wish for a designer account is recorded as a
 * request (users.designer_requested_at) that an admin approves on the admin desk.
 */
export function rolesAtSignUp(): Role[] {
  return ['quilter']
}

export function isRole(value: string): value is Role {
  return (ROLES as readonly string[]).includes(value)
}
