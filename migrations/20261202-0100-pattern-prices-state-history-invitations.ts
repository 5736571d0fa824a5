import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * A pattern's life (issue 13): its price, the record of every state change, and the testers it
 * was offered to.
 *
 * - `patterns.price_cents` / `currency`: what the pattern sells for, in integer cents of an
 *   ISO 4217 currency. Both empty until the designer sets a price; both set together, the price
 *   above zero. Publishing needs them (lib/services/patterns.ts); the shop reads them.
 * - `pattern_state_changes`: one row per change (from, to, who, when), written in the transaction
 *   of the change. The person is kept as an id that becomes NULL if their account is deleted.
 * - `pattern_invitations`: a designer asks someone, by e-mail address, to test a pattern. The row
 *   is claimed (`user_id`, `accepted_at`) by the verified owner of that address; a withdrawn or
 *   expired one gives no access. One live (not withdrawn) invitation per address and pattern.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('patterns', 'price_cents', { type: DataTypes.INTEGER, allowNull: true })
  await queryInterface.addColumn('patterns', 'currency', { type: DataTypes.TEXT, allowNull: true })
  await queryInterface.sequelize.query(`
    ALTER TABLE patterns ADD CONSTRAINT patterns_price_positive CHECK (price_cents IS NULL OR price_cents > 0);
    ALTER TABLE patterns ADD CONSTRAINT patterns_currency_iso CHECK (currency IS NULL OR currency ~ '^[A-Z]{3}$');
    ALTER TABLE patterns ADD CONSTRAINT patterns_price_with_currency CHECK ((price_cents IS NULL) = (currency IS NULL));
  `)

  await queryInterface.createTable('pattern_state_changes', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'CASCADE' },
    from_state: { type: DataTypes.TEXT, allowNull: false },
    to_state: { type: DataTypes.TEXT, allowNull: false },
    changed_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.addIndex('pattern_state_changes', ['pattern_id', 'created_at'])

  await queryInterface.createTable('pattern_invitations', {
    id: { type: DataTypes.UUID, primaryKey: true },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'CASCADE' },
    email: { type: DataTypes.TEXT, allowNull: false },
    invited_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    withdrawn_at: { type: DataTypes.DATE, allowNull: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.sequelize.query(`
    CREATE UNIQUE INDEX pattern_invitations_one_live_per_address ON pattern_invitations (pattern_id, lower(email)) WHERE withdrawn_at IS NULL;
    CREATE INDEX pattern_invitations_by_user ON pattern_invitations (user_id) WHERE user_id IS NOT NULL;
    CREATE INDEX pattern_invitations_by_address ON pattern_invitations (lower(email)) WHERE user_id IS NULL;
    CREATE INDEX pattern_invitations_by_inviter ON pattern_invitations (invited_by_id, created_at);
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('pattern_invitations')
  await queryInterface.dropTable('pattern_state_changes')
  await queryInterface.sequelize.query(`
    ALTER TABLE patterns DROP CONSTRAINT patterns_price_with_currency;
    ALTER TABLE patterns DROP CONSTRAINT patterns_currency_iso;
    ALTER TABLE patterns DROP CONSTRAINT patterns_price_positive;
  `)
  await queryInterface.removeColumn('patterns', 'currency')
  await queryInterface.removeColumn('patterns', 'price_cents')
}
