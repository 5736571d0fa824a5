import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The sewing room (issue 15):
 * - `sewing_projects`: a quilter's make of one pattern, under their licence or (for a tester) their
 *   invitation — exactly one of the two — at the pattern revision the checklist was made from, in
 *   one colourway (its index in that revision's design), finished diameter and paper. A pattern may
 *   be made several times, so nothing here is unique per licence.
 * - `sewing_steps`: progress, one row per step of the checklist (its stable id, e.g.
 *   `r3:area:A4`), so two devices ticking different steps both land; the same step written twice
 *   keeps the last write. Steps never ticked have no row.
 * Deleting follows the licences' rules (migration 20261202-0120): a person's account takes their
 * projects with it, as it takes their licences; a licence or invitation deleted takes its projects;
 * a refund only revokes the licence (the row stays), and the service then refuses the project.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const now = queryInterface.sequelize.literal('now()')
  await queryInterface.createTable('sewing_projects', {
    id: { type: DataTypes.UUID, primaryKey: true },
    owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    licence_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'licences', key: 'id' }, onDelete: 'CASCADE' },
    invitation_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'pattern_invitations', key: 'id' }, onDelete: 'CASCADE' },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'CASCADE' },
    pattern_revision_id: { type: DataTypes.BIGINT, allowNull: false, references: { model: 'pattern_revisions', key: 'id' }, onDelete: 'CASCADE' },
    colorway_index: { type: DataTypes.INTEGER, allowNull: false },
    diameter_in: { type: DataTypes.DOUBLE, allowNull: false },
    paper: { type: DataTypes.TEXT, allowNull: false },
    name: { type: DataTypes.TEXT, allowNull: true },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE sewing_projects
      ADD CONSTRAINT sewing_projects_one_grant CHECK ((licence_id IS NULL) <> (invitation_id IS NULL)),
      ADD CONSTRAINT sewing_projects_colorway_index CHECK (colorway_index >= 0),
      ADD CONSTRAINT sewing_projects_diameter_positive CHECK (diameter_in > 0 AND diameter_in <= 200),
      ADD CONSTRAINT sewing_projects_name_length CHECK (name IS NULL OR char_length(name) BETWEEN 1 AND 120);
    CREATE INDEX sewing_projects_by_owner ON sewing_projects (owner_id, updated_at);
    CREATE INDEX sewing_projects_by_licence ON sewing_projects (licence_id) WHERE licence_id IS NOT NULL;
    CREATE INDEX sewing_projects_by_invitation ON sewing_projects (invitation_id) WHERE invitation_id IS NOT NULL;
    CREATE INDEX sewing_projects_by_pattern ON sewing_projects (pattern_id);
    CREATE INDEX sewing_projects_by_revision ON sewing_projects (pattern_revision_id);
  `)

  await queryInterface.createTable('sewing_steps', {
    project_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'sewing_projects', key: 'id' }, onDelete: 'CASCADE' },
    step_id: { type: DataTypes.TEXT, allowNull: false, primaryKey: true },
    done: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    note: { type: DataTypes.TEXT, allowNull: true },
    updated_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE sewing_steps
      ADD CONSTRAINT sewing_steps_step_id_length CHECK (char_length(step_id) BETWEEN 1 AND 200),
      ADD CONSTRAINT sewing_steps_note_length CHECK (note IS NULL OR char_length(note) <= 1000);
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('sewing_steps')
  await queryInterface.dropTable('sewing_projects')
}
