import type { QueryInterface } from 'sequelize'

/**
 * Change notices for what web processes keep in memory (lib/row-changes.ts): every insert, update
 * or delete of a row that a kept answer was made from sends `NOTIFY row_changes, '<tag>'` at commit,
 * a tag being `<table>:<id>` (a child row names its parent: a tick is `sewing_projects:<project>`),
 * and a TRUNCATE sends `<table>:*`. PostgreSQL sends each distinct tag once per transaction.
 *
 * The trigger's arguments are pairs of a tag's table and the column whose value (old and new row)
 * completes it, so one function serves every table.
 */
/** lib/row-changes.ts listens on this channel (ROW_CHANGE_CHANNEL there). */
const ROW_CHANGE_CHANNEL = 'row_changes'

const NOTICES: Record<string, [string, string][]> = {
  sessions: [['sessions', 'id']],
  users: [['users', 'id']],
  patterns: [['patterns', 'id']],
  pattern_invitations: [['pattern_invitations', 'id'], ['patterns', 'pattern_id']],
  licences: [['licences', 'id']],
  sewing_projects: [['sewing_projects', 'id']],
  sewing_steps: [['sewing_projects', 'project_id']],
}

export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const { sequelize } = queryInterface
  await sequelize.query(`
    CREATE FUNCTION wreathwright_row_changed() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      position integer := 0;
      value text;
    BEGIN
      WHILE position < TG_NARGS LOOP
        IF TG_OP <> 'INSERT' THEN
          EXECUTE format('SELECT ($1).%I::text', TG_ARGV[position + 1]) INTO value USING OLD;
          IF value IS NOT NULL THEN PERFORM pg_notify('${ROW_CHANGE_CHANNEL}', TG_ARGV[position] || ':' || value); END IF;
        END IF;
        IF TG_OP <> 'DELETE' THEN
          EXECUTE format('SELECT ($1).%I::text', TG_ARGV[position + 1]) INTO value USING NEW;
          IF value IS NOT NULL THEN PERFORM pg_notify('${ROW_CHANGE_CHANNEL}', TG_ARGV[position] || ':' || value); END IF;
        END IF;
        position := position + 2;
      END LOOP;
      RETURN NULL;
    END $$`)
  await sequelize.query(`
    CREATE FUNCTION wreathwright_table_emptied() RETURNS trigger LANGUAGE plpgsql AS $$
    DECLARE
      position integer := 0;
    BEGIN
      WHILE position < TG_NARGS LOOP
        PERFORM pg_notify('${ROW_CHANGE_CHANNEL}', TG_ARGV[position] || ':*');
        position := position + 2;
      END LOOP;
      RETURN NULL;
    END $$`)
  for (const [table, pairs] of Object.entries(NOTICES)) {
    const argumentsList = pairs.flat().map((word) => `'${word}'`).join(', ')
    await sequelize.query(`CREATE TRIGGER ${table}_row_changed AFTER INSERT OR UPDATE OR DELETE ON ${table} FOR EACH ROW EXECUTE FUNCTION wreathwright_row_changed(${argumentsList})`)
    await sequelize.query(`CREATE TRIGGER ${table}_emptied AFTER TRUNCATE ON ${table} FOR EACH STATEMENT EXECUTE FUNCTION wreathwright_table_emptied(${argumentsList})`)
  }
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  const { sequelize } = queryInterface
  for (const table of Object.keys(NOTICES)) {
    await sequelize.query(`DROP TRIGGER ${table}_emptied ON ${table}`)
    await sequelize.query(`DROP TRIGGER ${table}_row_changed ON ${table}`)
  }
  await sequelize.query('DROP FUNCTION wreathwright_table_emptied()')
  await sequelize.query('DROP FUNCTION wreathwright_row_changed()')
}
