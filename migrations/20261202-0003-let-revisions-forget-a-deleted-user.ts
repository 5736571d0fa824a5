import type { QueryInterface } from 'sequelize'

/**
 * Revisions stay immutable, except that deleting a user who saved one sets its `saved_by_id` to
 * NULL (the foreign key's ON DELETE SET NULL is an UPDATE, which the first trigger refused, so
 * such a user could not be deleted at all).
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query(`
    CREATE OR REPLACE FUNCTION pattern_revisions_refuse_update() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF NEW.saved_by_id IS NULL AND OLD.saved_by_id IS NOT NULL
         AND (NEW.id, NEW.pattern_id, NEW.revision, NEW.name, NEW.state, NEW.design::text, NEW.created_at)
             IS NOT DISTINCT FROM (OLD.id, OLD.pattern_id, OLD.revision, OLD.name, OLD.state, OLD.design::text, OLD.created_at) THEN
        RETURN NEW;
      END IF;
      RAISE EXCEPTION 'pattern revisions are immutable';
    END $$;
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query(`
    CREATE OR REPLACE FUNCTION pattern_revisions_refuse_update() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'pattern revisions are immutable';
    END $$;
  `)
}
