import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The outgoing mail log (issue 12): one row per message the product sends, written in the same
 * transaction as its job on the queue (pg-boss keeps its own schema `pgboss`, made by pg-boss
 * itself). To, kind, state and times only: never a subject or a body, which may hold a secret link.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('outgoing_mails', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    to_address: { type: DataTypes.TEXT, allowNull: false },
    kind: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    last_error: { type: DataTypes.TEXT, allowNull: true },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
    sent_at: { type: DataTypes.DATE, allowNull: true },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE outgoing_mails
      ADD CONSTRAINT outgoing_mails_state_known CHECK (state IN ('queued','sent','failed')),
      ADD CONSTRAINT outgoing_mails_attempts_counted CHECK (attempts >= 0),
      ADD CONSTRAINT outgoing_mails_sent_has_time CHECK ((state = 'sent') = (sent_at IS NOT NULL))`)
  // The admin's log reads newest first; a person's own messages by user.
  await queryInterface.addIndex('outgoing_mails', ['created_at'])
  await queryInterface.addIndex('outgoing_mails', ['user_id'])
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('outgoing_mails')
}
