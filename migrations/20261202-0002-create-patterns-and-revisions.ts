import { DataTypes, type QueryInterface } from 'sequelize'

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('patterns', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'draft' },
    design: { type: DataTypes.JSONB, allowNull: false },
    revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.sequelize.query(
    "ALTER TABLE patterns ADD CONSTRAINT patterns_state_known CHECK (state IN ('draft','testing','published','retired'))",
  )
  await queryInterface.sequelize.query('ALTER TABLE patterns ADD CONSTRAINT patterns_revision_positive CHECK (revision > 0)')
  await queryInterface.addIndex('patterns', ['owner_id'])

  await queryInterface.createTable('pattern_revisions', {
    id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
    pattern_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'patterns', key: 'id' },
      onDelete: 'CASCADE',
    },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.TEXT, allowNull: false },
    design: { type: DataTypes.JSONB, allowNull: false },
    saved_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.addIndex('pattern_revisions', ['pattern_id', 'revision'], { unique: true })

  // Every save is kept as it was: a revision row can be added or removed with its pattern, never changed.
  await queryInterface.sequelize.query(`
    CREATE FUNCTION pattern_revisions_refuse_update() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'pattern revisions are immutable';
    END $$;
    CREATE TRIGGER pattern_revisions_immutable BEFORE UPDATE ON pattern_revisions
      FOR EACH ROW EXECUTE FUNCTION pattern_revisions_refuse_update();
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('pattern_revisions')
  await queryInterface.sequelize.query('DROP FUNCTION IF EXISTS pattern_revisions_refuse_update()')
  await queryInterface.dropTable('patterns')
}
