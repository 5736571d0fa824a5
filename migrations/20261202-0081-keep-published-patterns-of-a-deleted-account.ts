import type { QueryInterface } from 'sequelize'

/**
 * When a designer deletes their account, their drafts and patterns in testing go with it
 * (lib/services/account-settings.ts deletes them), but a published or retired pattern stays for
 * the people who hold a licence to it: its owner becomes NULL instead of the row being deleted.
 * Before this, `patterns.owner_id` was NOT NULL with ON DELETE CASCADE.
 * Going down deletes such ownerless patterns, since the old schema cannot hold them.
 */
export async function up({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query(`
    ALTER TABLE patterns ALTER COLUMN owner_id DROP NOT NULL;
    ALTER TABLE patterns DROP CONSTRAINT IF EXISTS patterns_owner_id_fkey;
    ALTER TABLE patterns ADD CONSTRAINT patterns_owner_id_fkey FOREIGN KEY (owner_id) REFERENCES users (id) ON DELETE SET NULL;
    ALTER TABLE patterns ADD CONSTRAINT patterns_ownerless_only_when_public CHECK (owner_id IS NOT NULL OR state IN ('published','retired'));
  `)
}

export async function down({ context: queryInterface }: { context: QueryInterface }): Promise<void> {
  await queryInterface.sequelize.query(`
    DELETE FROM patterns WHERE owner_id IS NULL;
    ALTER TABLE patterns DROP CONSTRAINT patterns_ownerless_only_when_public;
    ALTER TABLE patterns DROP CONSTRAINT patterns_owner_id_fkey;
    ALTER TABLE patterns ADD CONSTRAINT patterns_owner_id_fkey FOREIGN KEY (owner_id) REFERENCES users (id) ON DELETE CASCADE;
    ALTER TABLE patterns ALTER COLUMN owner_id SET NOT NULL;
  `)
}
