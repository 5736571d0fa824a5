import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * Uploaded images (issue 11): a theme-fabric photo with its proposed palette, a fabric's swatch,
 * later a pattern's cover and a test report's photo. The image itself is in the object store under
 * `key`; this row says whose it is and what it is. Only images the server decoded, resized and
 * re-encoded are recorded (lib/services/uploads.ts), hence the checks.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.createTable('uploads', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    kind: { type: DataTypes.TEXT, allowNull: false },
    key: { type: DataTypes.TEXT, allowNull: false, unique: true },
    content_type: { type: DataTypes.TEXT, allowNull: false },
    width: { type: DataTypes.INTEGER, allowNull: false },
    height: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    /** Colours proposed from the image (`#rrggbb`), for a theme-fabric photo; null for other kinds. */
    palette: { type: DataTypes.JSONB, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: queryInterface.sequelize.literal('now()') },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE uploads
      ADD CONSTRAINT uploads_kind_known CHECK (kind IN ('fabric-photo','swatch','cover','report-photo')),
      ADD CONSTRAINT uploads_content_type_known CHECK (content_type IN ('image/jpeg','image/png','image/webp')),
      ADD CONSTRAINT uploads_size_positive CHECK (width > 0 AND height > 0 AND bytes > 0)`)
  await queryInterface.addIndex('uploads', ['owner_id', 'kind', 'created_at'])
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('uploads')
}
