import { DataTypes, QueryTypes, type QueryInterface } from 'sequelize'
import { listingSummary } from '../lib/shop/listing-summary'

/**
 * The shop's listings (issue 14): what the list shows and filters by, kept beside each pattern so
 * that listing never reads the designs (a design may be megabytes).
 *
 * - `colorway_swatches`: each colourway's name and its fabrics' colours, for the cards' swatches;
 *   `colour_families`: the hue families those colours fall into (lib/shop/colour-families.ts), for
 *   the colour filter. Both written on every save of a design (models/pattern.ts) and backfilled
 *   here with the same function (lib/shop/listing-summary.ts). A later change of the family rule
 *   needs a migration of its own to recompute them.
 * - `skill_notes`: the designer's short words on what the pattern asks of a quilter (optional).
 * - `published_at`: when the pattern last went on sale, for "newest first"; backfilled from the
 *   state-change history (or the last change of the row when there is none).
 * - `hidden_at`: an admin took the listing out of the shop (the pattern stays published for its
 *   licence holders). The audit log learns the two actions that set and clear it.
 * - Indexes: the listed patterns newest first (the default order of the shop), the colour filter
 *   (GIN over the families), "contains" search on the name (trigram, as the users' names have).
 */
const OLD_ACTIONS = ['grant-role', 'revoke-role', 'disable-account', 'enable-account', 'approve-designer-request', 'decline-designer-request']
const NEW_ACTIONS = [...OLD_ACTIONS, 'hide-listing', 'show-listing']
const actionCheck = (actions: readonly string[]) =>
  `ALTER TABLE admin_audit_entries ADD CONSTRAINT admin_audit_entries_action_known CHECK (action IN (${actions.map((action) => `'${action}'`).join(', ')}))`

/** Longest skill notes, characters: a paragraph or two, not the booklet. */
const MAX_SKILL_NOTES = 2000

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('patterns', 'colour_families', { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false, defaultValue: [] })
  await queryInterface.addColumn('patterns', 'colorway_swatches', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] })
  await queryInterface.addColumn('patterns', 'skill_notes', { type: DataTypes.TEXT, allowNull: true })
  await queryInterface.addColumn('patterns', 'published_at', { type: DataTypes.DATE, allowNull: true })
  await queryInterface.addColumn('patterns', 'hidden_at', { type: DataTypes.DATE, allowNull: true })
  await queryInterface.sequelize.query(`
    ALTER TABLE patterns ADD CONSTRAINT patterns_skill_notes_length CHECK (skill_notes IS NULL OR char_length(skill_notes) <= ${MAX_SKILL_NOTES});
    UPDATE patterns SET published_at = COALESCE(
      (SELECT max(created_at) FROM pattern_state_changes WHERE pattern_id = patterns.id AND to_state = 'published'),
      patterns.updated_at)
    WHERE state IN ('published', 'retired');
    CREATE INDEX patterns_listed_newest ON patterns (published_at DESC NULLS LAST, id) WHERE state = 'published' AND hidden_at IS NULL;
    CREATE INDEX patterns_colour_families ON patterns USING gin (colour_families);
    CREATE INDEX patterns_name_trigram ON patterns USING gin (lower(name) gin_trgm_ops);
  `)
  // Designs are read a hundred at a time, so a large table never sits in memory at once.
  for (let after = '00000000-0000-0000-0000-000000000000'; ;) {
    const rows = await queryInterface.sequelize.query<{ id: string; design: unknown }>(
      'SELECT id, design FROM patterns WHERE id > :after ORDER BY id LIMIT 100',
      { type: QueryTypes.SELECT, replacements: { after } },
    )
    if (rows.length === 0) break
    for (const row of rows) {
      const summary = listingSummary(row.design)
      await queryInterface.sequelize.query(
        'UPDATE patterns SET colour_families = CAST(:families AS text[]), colorway_swatches = CAST(:swatches AS jsonb) WHERE id = :id',
        { replacements: { id: row.id, families: `{${summary.colourFamilies.join(',')}}`, swatches: JSON.stringify(summary.colorwaySwatches) } },
      )
    }
    after = rows[rows.length - 1]!.id
  }
  await queryInterface.sequelize.query('ALTER TABLE admin_audit_entries DROP CONSTRAINT admin_audit_entries_action_known')
  await queryInterface.sequelize.query(actionCheck(NEW_ACTIONS))
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query('ALTER TABLE admin_audit_entries DROP CONSTRAINT admin_audit_entries_action_known')
  // Entries of the newer actions cannot be removed (the log refuses DELETE): the older check then
  // holds for new rows only (NOT VALID leaves existing rows unchecked).
  await queryInterface.sequelize.query(`${actionCheck(OLD_ACTIONS)} NOT VALID`)
  await queryInterface.sequelize.query(`
    DROP INDEX patterns_name_trigram;
    DROP INDEX patterns_colour_families;
    DROP INDEX patterns_listed_newest;
    ALTER TABLE patterns DROP CONSTRAINT patterns_skill_notes_length;
  `)
  for (const column of ['hidden_at', 'published_at', 'skill_notes', 'colorway_swatches', 'colour_families']) await queryInterface.removeColumn('patterns', column)
}
