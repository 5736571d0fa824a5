import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The shop's payments (issue 14):
 * - `orders`: one row per checkout started, with the amount read from the pattern at that moment
 *   (integer cents and an ISO 4217 currency) and the provider's checkout session; 'pending' until a
 *   verified webhook says it was paid, 'refunded' once the provider says the charge was refunded.
 * - `licences`: what a paid order grants its buyer, numbered for people to read (`WL-001001`, from
 *   a sequence); a refund revokes it (`revoked_at`), the row stays.
 * - `payment_events`: every webhook call, verified or refused, with the provider's event id unique
 *   so the same event delivered twice is stored (and processed) once.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const now = queryInterface.sequelize.literal('now()')
  await queryInterface.createTable('orders', {
    id: { type: DataTypes.UUID, primaryKey: true },
    buyer_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    // A sold pattern cannot be deleted (its licences point at it); retiring it is the way out.
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'RESTRICT' },
    amount_cents: { type: DataTypes.INTEGER, allowNull: false },
    currency: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'pending' },
    checkout_session_id: { type: DataTypes.TEXT, allowNull: false, unique: true },
    payment_intent_id: { type: DataTypes.TEXT, allowNull: true, unique: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    refunded_at: { type: DataTypes.DATE, allowNull: true },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE orders
      ADD CONSTRAINT orders_amount_positive CHECK (amount_cents > 0),
      ADD CONSTRAINT orders_currency_iso CHECK (currency ~ '^[A-Z]{3}$'),
      ADD CONSTRAINT orders_state_known CHECK (state IN ('pending','paid','refunded'));
    CREATE INDEX orders_by_buyer ON orders (buyer_id, created_at);
    CREATE INDEX orders_by_pattern ON orders (pattern_id, created_at);
    CREATE SEQUENCE licence_numbers START 1001;
  `)

  await queryInterface.createTable('licences', {
    id: { type: DataTypes.UUID, primaryKey: true },
    number: {
      type: DataTypes.TEXT,
      allowNull: false,
      unique: true,
      defaultValue: queryInterface.sequelize.literal(`'WL-' || to_char(nextval('licence_numbers'), 'FM000000')`),
    },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'RESTRICT' },
    order_id: { type: DataTypes.UUID, allowNull: false, unique: true, references: { model: 'orders', key: 'id' }, onDelete: 'CASCADE' },
    granted_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    revoked_at: { type: DataTypes.DATE, allowNull: true },
  })
  await queryInterface.sequelize.query(`
    CREATE INDEX licences_by_user ON licences (user_id, granted_at);
    CREATE INDEX licences_live_by_pattern ON licences (pattern_id, user_id) WHERE revoked_at IS NULL;
  `)

  await queryInterface.createTable('payment_events', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    // NULL for a refused call: its id cannot be trusted.
    provider_event_id: { type: DataTypes.TEXT, allowNull: true, unique: true },
    type: { type: DataTypes.TEXT, allowNull: true },
    state: { type: DataTypes.TEXT, allowNull: false },
    /** Why a call was refused, or what processing made of it. */
    note: { type: DataTypes.TEXT, allowNull: true },
    payment_intent_id: { type: DataTypes.TEXT, allowNull: true },
    payload: { type: DataTypes.JSONB, allowNull: true },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    received_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    processed_at: { type: DataTypes.DATE, allowNull: true },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE payment_events
      ADD CONSTRAINT payment_events_state_known CHECK (state IN ('refused','received','processed','failed')),
      ADD CONSTRAINT payment_events_verified_have_ids CHECK (state = 'refused' OR provider_event_id IS NOT NULL);
    CREATE INDEX payment_events_by_time ON payment_events (received_at);
    CREATE INDEX payment_events_by_intent ON payment_events (payment_intent_id) WHERE payment_intent_id IS NOT NULL;
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('payment_events')
  await queryInterface.dropTable('licences')
  await queryInterface.dropTable('orders')
  await queryInterface.sequelize.query('DROP SEQUENCE IF EXISTS licence_numbers')
}
