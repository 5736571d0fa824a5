import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * Accounts by e-mail (issue 12):
 * - `account_tokens`: single-use links for verifying an address, resetting a password and changing
 *   the address. Only the SHA-256 hash of a token is stored, so a copy of the database lets nobody
 *   use a link; `used_at` and `expires_at` make each link work once and for a while
 *   (lib/auth/account-tokens.ts).
 * - `users.disabled_at`: an admin can disable an account; it then cannot sign in and its sessions end.
 * - `sessions.user_agent` and `last_seen_at`: the account page lists where one is signed in.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('account_tokens', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.TEXT, allowNull: false },
    /** Hex SHA-256 of the token the link carries. */
    token_hash: { type: DataTypes.TEXT, allowNull: false, unique: true },
    /** The address a change-email link moves the account to; null for the other purposes. */
    new_email: { type: DataTypes.TEXT, allowNull: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE account_tokens
      ADD CONSTRAINT account_tokens_purpose_known CHECK (purpose IN ('verify-email','reset-password','change-email')),
      ADD CONSTRAINT account_tokens_new_email_for_change CHECK ((purpose = 'change-email') = (new_email IS NOT NULL))`)
  await queryInterface.addIndex('account_tokens', ['user_id', 'purpose'])

  await queryInterface.addColumn('users', 'disabled_at', { type: DataTypes.DATE, allowNull: true })
  await queryInterface.addColumn('sessions', 'user_agent', { type: DataTypes.TEXT, allowNull: true })
  await queryInterface.addColumn('sessions', 'last_seen_at', {
    type: DataTypes.DATE,
    allowNull: false,
    defaultValue: queryInterface.sequelize.literal('now()'),
  })
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.removeColumn('sessions', 'last_seen_at')
  await queryInterface.removeColumn('sessions', 'user_agent')
  await queryInterface.removeColumn('users', 'disabled_at')
  await queryInterface.dropTable('account_tokens')
}
