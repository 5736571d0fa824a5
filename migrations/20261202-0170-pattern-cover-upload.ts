import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * A pattern's uploaded cover (issue 14): the designer's own image, shown in the shop instead of the
 * ring drawn from the design. `cover_upload_id` names an upload of kind `cover` (the listing
 * settings service checks the kind and the owner); when the upload goes (its owner's account is
 * deleted) the pattern falls back to the drawn ring. The index serves the public read of a cover:
 * "which patterns show this upload?" (lib/services/uploads.ts).
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('patterns', 'cover_upload_id', {
    type: DataTypes.UUID,
    allowNull: true,
    references: { model: 'uploads', key: 'id' },
    onDelete: 'SET NULL',
  })
  await queryInterface.sequelize.query('CREATE INDEX patterns_cover_upload ON patterns (cover_upload_id) WHERE cover_upload_id IS NOT NULL')
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query('DROP INDEX patterns_cover_upload')
  await queryInterface.removeColumn('patterns', 'cover_upload_id')
}
