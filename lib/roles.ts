/** What a person may do is decided by lib/authorization.ts; these are the roles it knows. */
export const ROLES = ['designer', 'tester', 'quilter', 'admin'] as const
export type Role = (typeof ROLES)[number]

/**
 * Roles a new account gets: everyone quilts; a person who asks for a designer account at
 * sign-up gets it too (an admin can also grant it later).
 */
export function rolesAtSignUp(wantsDesignerAccount: boolean): Role[] {
  return wantsDesignerAccount ? ['quilter', 'designer'] : ['quilter']
}

export function isRole(value: string): value is Role {
  return (ROLES as readonly string[]).includes(value)
}
