import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The admin desk's audit log (issue 12): one row per admin action — who, what, whom, when —
 * written in the same transaction as the action. Nobody may change or remove a row: triggers
 * refuse UPDATE, DELETE and TRUNCATE for every role the app connects as. (A superuser can still
 * switch triggers off; the log guards against the app and its admins, not the database's owner.)
 *
 * No foreign keys: an entry outlives the accounts it names (a person may delete their account), so
 * it keeps their name and e-mail as they were at the time beside their ids.
 *
 * Also the users table's indexes for the desk's search and sort: trigram indexes (pg_trgm, a
 * trusted extension since PostgreSQL 13) for "contains" searches on name and e-mail, and one per
 * sort order the users page offers (name, joined; e-mail already has lower(email)).
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('admin_audit_entries', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    actor_id: { type: DataTypes.UUID, allowNull: false },
    actor_label: { type: DataTypes.TEXT, allowNull: false },
    action: { type: DataTypes.TEXT, allowNull: false },
    target_id: { type: DataTypes.UUID, allowNull: true },
    target_label: { type: DataTypes.TEXT, allowNull: true },
    details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE admin_audit_entries ADD CONSTRAINT admin_audit_entries_action_known CHECK (action IN (
      'grant-role', 'revoke-role', 'disable-account', 'enable-account', 'approve-designer-request', 'decline-designer-request'))`)
  await queryInterface.sequelize.query('CREATE INDEX admin_audit_entries_newest_first ON admin_audit_entries (created_at DESC, id DESC)')
  await queryInterface.addIndex('admin_audit_entries', ['target_id'])
  await queryInterface.sequelize.query(`
    CREATE FUNCTION admin_audit_entries_refuse_change() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'the admin audit log cannot be changed: % refused', TG_OP USING ERRCODE = 'insufficient_privilege';
    END
    $$`)
  await queryInterface.sequelize.query(`
    CREATE TRIGGER admin_audit_entries_no_update_or_delete BEFORE UPDATE OR DELETE ON admin_audit_entries
      FOR EACH ROW EXECUTE FUNCTION admin_audit_entries_refuse_change()`)
  await queryInterface.sequelize.query(`
    CREATE TRIGGER admin_audit_entries_no_truncate BEFORE TRUNCATE ON admin_audit_entries
      FOR EACH STATEMENT EXECUTE FUNCTION admin_audit_entries_refuse_change()`)

  await queryInterface.sequelize.query('CREATE EXTENSION IF NOT EXISTS pg_trgm')
  await queryInterface.sequelize.query('CREATE INDEX users_display_name_trigram ON users USING gin (lower(display_name) gin_trgm_ops)')
  await queryInterface.sequelize.query('CREATE INDEX users_email_trigram ON users USING gin (lower(email) gin_trgm_ops)')
  await queryInterface.sequelize.query('CREATE INDEX users_display_name_order ON users (lower(display_name), id)')
  await queryInterface.sequelize.query('CREATE INDEX users_created_at_order ON users (created_at, id)')
  await queryInterface.sequelize.query('CREATE INDEX users_designer_requests_pending ON users (designer_requested_at) WHERE designer_requested_at IS NOT NULL')
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  for (const index of ['users_designer_requests_pending', 'users_created_at_order', 'users_display_name_order', 'users_email_trigram', 'users_display_name_trigram']) {
    await queryInterface.sequelize.query(`DROP INDEX ${index}`)
  }
  await queryInterface.sequelize.query('DROP EXTENSION IF EXISTS pg_trgm')
  // Dropping the table is a schema change, not an edit of its rows: the triggers go with it.
  await queryInterface.dropTable('admin_audit_entries')
  await queryInterface.sequelize.query('DROP FUNCTION admin_audit_entries_refuse_change()')
}
