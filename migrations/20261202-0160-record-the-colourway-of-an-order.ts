import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The colourway a buyer was looking at when they bought (issue 14, the designer's sales table): a
 * licence covers every colourway, so this is only what the designer sees in their sales, never a
 * limit on the buyer. The name is kept, not its place in the list, so that a designer reordering or
 * renaming colourways later does not change what past sales say. NULL for orders made before this
 * and for checkouts that named none. At most 120 characters, as every colourway name
 * (lib/limits.ts MAX_NAME_LENGTH).
 *
 * The sales table pages through paid orders newest first (lib/services/sales.ts), hence the index.
 */
const MAX_NAME_LENGTH = 120

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.addColumn('orders', 'colorway', { type: DataTypes.TEXT, allowNull: true })
  await queryInterface.sequelize.query(`
    ALTER TABLE orders ADD CONSTRAINT orders_colorway_length CHECK (colorway IS NULL OR char_length(colorway) BETWEEN 1 AND ${MAX_NAME_LENGTH});
    CREATE INDEX orders_paid_newest ON orders (paid_at DESC, id) WHERE paid_at IS NOT NULL;
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query('DROP INDEX orders_paid_newest; ALTER TABLE orders DROP CONSTRAINT orders_colorway_length;')
  await queryInterface.removeColumn('orders', 'colorway')
}
