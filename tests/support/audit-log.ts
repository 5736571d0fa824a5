import { database } from '@/lib/db'

/**
 * Empties the admin audit log and the mail log between tests. The audit log refuses TRUNCATE by
 * trigger; a test run connects as the database's superuser, who alone may switch triggers off, for
 * this one transaction (session_replication_role = replica). The app has no such way.
 */
export async function emptyAdminLogs(): Promise<void> {
  await database().transaction(async (transaction) => {
    await database().query('SET LOCAL session_replication_role = replica', { transaction })
    await database().query('TRUNCATE admin_audit_entries, outgoing_mails', { transaction })
  })
}
