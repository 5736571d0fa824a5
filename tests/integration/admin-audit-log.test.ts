import { QueryTypes } from 'sequelize'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { database } from '@/lib/db'
import { createMigrator } from '@/lib/migrator'
import { AdminAuditEntry } from '@/models'
import { emptyAdminLogs } from '../support/audit-log'
import { closeDatabase, freshDatabase } from '../support/database'

beforeEach(async () => {
  await freshDatabase()
  await emptyAdminLogs()
})
afterAll(closeDatabase)

const MIGRATION = '20261202-0090-create-admin-audit-entries.ts'

async function anEntry() {
  return AdminAuditEntry.create({
    actorId: '11111111-1111-4111-8111-111111111111',
    actorLabel: 'Odile Admin <odile@desk.test>',
    action: 'grant-role',
    targetId: '22222222-2222-4222-8222-222222222222',
    targetLabel: 'Wren Hollis <wren@example.test>',
    details: { role: 'designer' },
  })
}

describe('the admin audit log', () => {
  it('refuses UPDATE, DELETE and TRUNCATE at the database, whoever sends them', async () => {
    const entry = await anEntry()
    const refusal = /the admin audit log cannot be changed/
    await expect(database().query("UPDATE admin_audit_entries SET action = 'revoke-role'")).rejects.toThrow(refusal)
    await expect(database().query("UPDATE admin_audit_entries SET details = '{}' WHERE id = :id", { replacements: { id: entry.id } })).rejects.toThrow(refusal)
    await expect(database().query('DELETE FROM admin_audit_entries')).rejects.toThrow(refusal)
    await expect(database().query('TRUNCATE admin_audit_entries')).rejects.toThrow(refusal)
    // Through the model as well.
    await expect(entry.update({ targetLabel: 'Someone else' })).rejects.toThrow(refusal)
    await expect(entry.destroy()).rejects.toThrow(refusal)
    await expect(AdminAuditEntry.destroy({ where: {}, truncate: true })).rejects.toThrow(refusal)

    const [row] = await database().query<{ action: string; target_label: string; details: unknown }>('SELECT action, target_label, details FROM admin_audit_entries', { type: QueryTypes.SELECT })
    expect(row).toEqual({ action: 'grant-role', target_label: 'Wren Hollis <wren@example.test>', details: { role: 'designer' } })
  })

  it('takes only the actions it knows', async () => {
    await expect(AdminAuditEntry.create({ actorId: '11111111-1111-4111-8111-111111111111', actorLabel: 'x', action: 'rename-pattern' as 'grant-role', targetId: null, targetLabel: null })).rejects.toThrow(
      /admin_audit_entries_action_known/,
    )
  })

  it('goes down with its migration (table, trigger function, users indexes) and comes back up', async () => {
    await anEntry()
    const migrator = createMigrator(database())
    const exists = async (sql: string) => (await database().query<{ found: boolean }>(sql, { type: QueryTypes.SELECT }))[0]!.found
    const tableExists = () => exists("SELECT to_regclass('admin_audit_entries') IS NOT NULL AS found")
    const functionExists = () => exists("SELECT count(*) > 0 AS found FROM pg_proc WHERE proname = 'admin_audit_entries_refuse_change'")
    const indexExists = () => exists("SELECT to_regclass('users_display_name_trigram') IS NOT NULL AS found")
    const before = (await migrator.executed()).map((migration) => migration.name)
    expect(before).toContain(MIGRATION)

    // Down to just before it: every later migration first, then this one.
    const index = before.indexOf(MIGRATION)
    await migrator.down({ to: MIGRATION })
    expect((await migrator.executed()).map((migration) => migration.name)).toEqual(before.slice(0, index))
    expect([await tableExists(), await functionExists(), await indexExists()]).toEqual([false, false, false])

    await migrator.up()
    expect([await tableExists(), await functionExists(), await indexExists()]).toEqual([true, true, true])
    // The triggers came back with the table.
    await anEntry()
    await expect(database().query('DELETE FROM admin_audit_entries')).rejects.toThrow(/cannot be changed/)
  })
})
