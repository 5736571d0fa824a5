/**
 * An audit entry's action in words, as the audit log page shows it.
 *
 * @example auditWords('grant-role', { role: 'designer' }) // 'granted the designer role to'
 */
export function auditWords(action: string, details: Record<string, unknown>): string {
  const role = typeof details.role === 'string' ? details.role : 'a'
  switch (action) {
    case 'grant-role':
      return `granted the ${role} role to`
    case 'revoke-role':
      return `revoked the ${role} role from`
    case 'disable-account':
      return 'disabled the account of'
    case 'enable-account':
      return 're-enabled the account of'
    case 'approve-designer-request':
      return 'approved the designer request of'
    case 'decline-designer-request':
      return 'declined the designer request of'
    case 'hide-listing':
      return 'hid from the shop the listing of'
    case 'show-listing':
      return 'put back in the shop the listing of'
    case 'refund-order':
      return 'refunded the'
    default:
      return action
  }
}
