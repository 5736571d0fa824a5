import { DataTypes, type QueryInterface } from 'sequelize'

/**
 * The buyer's booklets (issue 14): one row per booklet built on the server for a licence holder,
 * by the booklet worker (scripts/booklet-worker.ts) off the web process. `cache_key` is a hash of
 * what the file depends on (pattern, revision, options, licence, the person and the name printed in
 * its footers): asking again for the same is answered by the row already queued, building or ready,
 * whose PDF is in the object store under `object_key`. A failed build does not count, so asking
 * again builds anew (the partial unique index).
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const now = queryInterface.sequelize.literal('now()')
  await queryInterface.createTable('booklet_builds', {
    id: { type: DataTypes.UUID, primaryKey: true },
    licence_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'licences', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    pattern_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'patterns', key: 'id' }, onDelete: 'CASCADE' },
    pattern_revision: { type: DataTypes.INTEGER, allowNull: false },
    options: { type: DataTypes.JSONB, allowNull: false },
    cache_key: { type: DataTypes.TEXT, allowNull: false },
    state: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'queued' },
    /** Pages written so far (the booklet's own page callback). */
    pages_done: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    /** The page count of the finished booklet. */
    page_count: { type: DataTypes.INTEGER, allowNull: true },
    object_key: { type: DataTypes.TEXT, allowNull: true },
    byte_size: { type: DataTypes.INTEGER, allowNull: true },
    /** What went wrong, in words for the buyer (never a stack). */
    error: { type: DataTypes.TEXT, allowNull: true },
    /** Which worker process built it (`host:pid`), for the logs and the tests. */
    built_by: { type: DataTypes.TEXT, allowNull: true },
    attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: { type: DataTypes.DATE, allowNull: false, defaultValue: now },
    started_at: { type: DataTypes.DATE, allowNull: true },
    finished_at: { type: DataTypes.DATE, allowNull: true },
  })
  await queryInterface.sequelize.query(`
    ALTER TABLE booklet_builds
      ADD CONSTRAINT booklet_builds_state_known CHECK (state IN ('queued','building','ready','failed')),
      ADD CONSTRAINT booklet_builds_ready_have_files CHECK (state <> 'ready' OR object_key IS NOT NULL);
    CREATE UNIQUE INDEX booklet_builds_one_live_per_key ON booklet_builds (cache_key) WHERE state <> 'failed';
    CREATE INDEX booklet_builds_by_user ON booklet_builds (user_id, created_at);
    CREATE INDEX booklet_builds_by_licence ON booklet_builds (licence_id);
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.dropTable('booklet_builds')
}
