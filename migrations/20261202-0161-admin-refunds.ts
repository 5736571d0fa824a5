import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * An admin refunds an order from the payment log (issue 14):
 * - `orders.refund_requested_at`: when an admin asked the provider to refund it. The order stays
 *   'paid' and its licence live until the provider's refund event arrives through the webhook, as
 *   for any other refund; this only keeps a second request from reaching the provider.
 * - the audit log learns the action 'refund-order'.
 */
const OLD_ACTIONS = ['grant-role', 'revoke-role', 'disable-account', 'enable-account', 'approve-designer-request', 'decline-designer-request', 'hide-listing', 'show-listing']
const NEW_ACTIONS = [...OLD_ACTIONS, 'refund-order']
const actionCheck = (actions: readonly string[]) =>
  `ALTER TABLE admin_audit_entries ADD CONSTRAINT admin_audit_entries_action_known CHECK (action IN (${actions.map((action) => `'${action}'`).join(', ')}))`

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('orders', 'refund_requested_at', { type: DataTypes.DATE, allowNull: true })
  await queryInterface.sequelize.query('ALTER TABLE admin_audit_entries DROP CONSTRAINT admin_audit_entries_action_known')
  await queryInterface.sequelize.query(actionCheck(NEW_ACTIONS))
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE admin_audit_entries DROP CONSTRAINT admin_audit_entries_action_known')
  // Entries of the newer action cannot be removed (the log refuses DELETE): the older check then
  // holds for new rows only (NOT VALID leaves existing rows unchecked).
  await queryInterface.sequelize.query(`${actionCheck(OLD_ACTIONS)} NOT VALID`)
  await queryInterface.removeColumn('orders', 'refund_requested_at')
}
