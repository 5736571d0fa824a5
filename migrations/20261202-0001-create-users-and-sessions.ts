import { DataTypes, type QueryInterface } from 'sequelize'

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('users', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    email: { type: DataTypes.TEXT, allowNull: false },
    display_name: { type: DataTypes.TEXT, allowNull: false },
    password_hash: { type: DataTypes.TEXT, allowNull: false },
    email_verified_at: { type: DataTypes.DATE, allowNull: true },
    roles: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: ['quilter'] },
    designer_requested_at: { type: DataTypes.DATE, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  // E-mail addresses are compared without regard to case (Ann@x and ann@x are one person).
  await queryInterface.sequelize.query('CREATE UNIQUE INDEX users_email_lower_unique ON users (lower(email))')
  await queryInterface.sequelize.query(
    "ALTER TABLE users ADD CONSTRAINT users_roles_known CHECK (roles <@ ARRAY['designer','tester','quilter','admin']::text[])",
  )

  await queryInterface.createTable('sessions', {
    id: { type: DataTypes.TEXT, primaryKey: true },
    user_id: {
      type: DataTypes.UUID,
      allowNull: false,
      references: { model: 'users', key: 'id' },
      onDelete: 'CASCADE',
    },
    expires_at: { type: DataTypes.DATE, allowNull: false },
  })
  await queryInterface.addIndex('sessions', ['user_id'])
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('sessions')
  await queryInterface.dropTable('users')
}
