import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * Test reports (issue 13): what a pattern's testers tell its designer, with a thread of answers
 * and photos.
 * - reports: one per problem, on a pattern and against the revision the tester sewed; its place
 *   as the tester named it (`place`) and its pin as worked out when filed (`pin`: the point and
 *   the area label under it, to tell later whether the design has changed there).
 * - report_messages: the thread, oldest first.
 * - report_photos: the report's photos, uploads of kind 'report-photo' owned by the tester; this
 *   link is what lets the pattern's designer and testers read them (lib/authorization.ts).
 * A deleted account leaves its reports and answers to the designer without a name (SET NULL); a
 * deleted pattern takes its reports along; a removed upload leaves the report without that photo.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const now = queryInterface.sequelize.literal('now()')
  await queryInterface.createTable('reports', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'CASCADE' },
    tester_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: DataTypes.TEXT, allowNull: false },
    severity: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    place: { type: DataTypes.JSONB, allowNull: false },
    pin: { type: DataTypes.JSONB, allowNull: true },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'open' },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE reports
      ADD CONSTRAINT reports_kind_known CHECK (kind IN ('fit','cutting','printing','instructions','other')),
      ADD CONSTRAINT reports_severity_known CHECK (severity IN ('minor','needs-fixing','blocks-sewing')),
      ADD CONSTRAINT reports_state_known CHECK (state IN ('open','resolved')),
      ADD CONSTRAINT reports_revision_positive CHECK (revision > 0)`)
  await queryInterface.addIndex('reports', ['pattern_id', 'created_at'])
  await queryInterface.addIndex('reports', ['tester_id'])

  await queryInterface.createTable('report_messages', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: queryInterface.sequelize.literal('gen_random_uuid()') },
    report_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'reports', key: 'id' }, onDelete: 'CASCADE' },
    author_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    author_role: { type: DataTypes.TEXT, allowNull: false },
    text: { type: DataTypes.TEXT, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  })
  await queryInterface.sequelize.query(`ALTER TABLE report_messages ADD CONSTRAINT report_messages_author_role_known CHECK (author_role IN ('designer','tester','admin'))`)
  await queryInterface.addIndex('report_messages', ['report_id', 'created_at'])

  await queryInterface.createTable('report_photos', {
    report_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'reports', key: 'id' }, onDelete: 'CASCADE' },
    upload_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'uploads', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
  })
  await queryInterface.addIndex('report_photos', ['upload_id'])
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('report_photos')
  await queryInterface.dropTable('report_messages')
  await queryInterface.dropTable('reports')
}
