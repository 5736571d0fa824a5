import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The pattern shelf lists names, states and a few figures of each design; it read every full
 * design to do so (a design may be megabytes). These columns keep what it shows beside the design,
 * written on every save (models/pattern.ts, lib/design-summary.ts) and backfilled here from the
 * designs already stored, the same way.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('patterns', 'repeats', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 })
  await queryInterface.addColumn('patterns', 'outer_diameter_inches', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 })
  await queryInterface.addColumn('patterns', 'seam_count', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 })
  // jsonb_typeof guards keep a hand-damaged design from failing the migration: it gets zeros.
  await queryInterface.sequelize.query(`
    UPDATE patterns SET
      repeats = CASE WHEN jsonb_typeof(design #> '{ring,repeats}') = 'number' THEN (design #>> '{ring,repeats}')::numeric::integer ELSE 0 END,
      outer_diameter_inches = CASE WHEN jsonb_typeof(design #> '{ring,outerRadius}') = 'number'
        THEN 2 * (design #>> '{ring,outerRadius}')::double precision / (CASE WHEN design ->> 'units' = 'cm' THEN 2.54 ELSE 1 END)
        ELSE 0 END,
      seam_count = CASE WHEN jsonb_typeof(design -> 'seams') = 'array' THEN jsonb_array_length(design -> 'seams') ELSE 0 END
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.removeColumn('patterns', 'seam_count')
  await queryInterface.removeColumn('patterns', 'outer_diameter_inches')
  await queryInterface.removeColumn('patterns', 'repeats')
}
