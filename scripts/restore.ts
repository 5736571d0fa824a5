/**
 * npm run restore -- <backup folder> --yes
 *
 * Puts back what `npm run backup` saved, into the database of DATABASE_URL and the object store
 * of S3_* (the app's settings):
 *   1. checks the folder first: its manifest, and every file's size and SHA-256 — a damaged or
 *      incomplete backup changes nothing;
 *   2. writes every saved object back (same key, same bytes, same content type);
 *   3. restores the database in one transaction: the app's schemas (public, pgboss) are dropped
 *      and made again from the backup with their rows, or, if anything fails, nothing changes;
 *   4. only then removes the objects under S3_KEY_PREFIX that the backup does not have (uploaded
 *      after it), so the store matches the rows again.
 * Stop the app and the workers first (their connections would hold the tables). `--yes` is
 * required: the restore replaces what is there now.
 *
 * Errors: one line on stderr; exit 2 for bad arguments (or a folder that is not a whole backup),
 * 1 when the restore failed.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { DeleteObjectsCommand, ListObjectsV2Command, PutObjectCommand } from '@aws-sdk/client-s3'
import { backupSources, databaseName, MANIFEST_FILE, runPostgresProgram, sha256OfFile, type Manifest } from './backup-folder'
import { UsageError } from './command-arguments'

/** The schemas the app's database holds: its tables (public) and the job queue's (pg-boss). */
const APP_SCHEMAS = ['pgboss', 'public'] as const

const USAGE = 'usage: npm run restore -- <backup folder> --yes'

function parseArguments(args: readonly string[]): { folder: string } {
  const unknown = args.find((arg) => arg.startsWith('-') && arg !== '--yes')
  if (unknown) throw new UsageError(`unknown option ${unknown}; ${USAGE}`)
  const positional = args.filter((arg) => !arg.startsWith('-'))
  if (positional.length !== 1) throw new UsageError(positional.length === 0 ? USAGE : `expected one backup folder, got ${positional.length}; ${USAGE}`)
  if (!args.includes('--yes')) throw new UsageError(`restoring replaces the database and the stored files; add --yes to go ahead; ${USAGE}`)
  return { folder: path.resolve(positional[0]!) }
}

/** The folder's manifest, once every file it names is there with its size and SHA-256. */
async function checkedManifest(folder: string): Promise<Manifest> {
  const manifestFile = path.join(folder, MANIFEST_FILE)
  if (!fs.existsSync(manifestFile)) throw new UsageError(`${folder} has no ${MANIFEST_FILE}: not a finished backup`)
  let manifest: Manifest
  try {
    manifest = JSON.parse(fs.readFileSync(manifestFile, 'utf8')) as Manifest
  } catch {
    throw new UsageError(`${manifestFile} is not JSON`)
  }
  if (manifest.format !== 'wreathwright-backup' || manifest.version !== 1) throw new UsageError(`${manifestFile} is not a Wreathwright backup manifest of version 1`)
  const files = [manifest.database, ...(manifest.objects?.items ?? [])]
  for (const entry of files) {
    const file = path.resolve(folder, entry.file)
    if (path.relative(folder, file).startsWith('..')) throw new UsageError(`the manifest names a file outside the backup: ${entry.file}`)
    if (!fs.existsSync(file)) throw new UsageError(`the backup is incomplete: ${entry.file} is missing`)
    if (fs.statSync(file).size !== entry.bytes || (await sha256OfFile(file)) !== entry.sha256) {
      throw new UsageError(`the backup is damaged: ${entry.file} does not match its size and SHA-256 in the manifest`)
    }
  }
  return manifest
}

async function restore(folder: string): Promise<{ manifest: Manifest; written: number; removed: number }> {
  const manifest = await checkedManifest(folder)
  const { databaseUrl, store } = backupSources()
  if (manifest.objects && !store) throw new Error('the backup holds stored files but no object store is configured here (S3_ENDPOINT, S3_BUCKET)')

  let written = 0
  if (manifest.objects && store) {
    for (const item of manifest.objects.items) {
      // The key as saved; a backup from a store with another prefix lands under this one's.
      const key = `${store.keyPrefix}${item.key.slice(manifest.objects.keyPrefix.length)}`
      const body = fs.readFileSync(path.join(folder, item.file))
      await store.client.send(
        new PutObjectCommand({ Bucket: store.bucket, Key: key, Body: body, ContentLength: body.byteLength, ...(item.contentType ? { ContentType: item.contentType } : {}) }),
      )
      written += 1
    }
  }

  // pg_restore --clean cannot drop a partition's inherited key (pg-boss keeps one partition per
  // queue), so the schemas the app owns are dropped whole and made again from the backup's SQL,
  // all in one psql transaction: everything is restored, or nothing changes.
  const script = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-restore-')), 'database.sql')
  try {
    await runPostgresProgram('pg_restore', ['--no-owner', '--no-privileges', '--file', script, path.join(folder, manifest.database.file)], databaseUrl)
    await runPostgresProgram(
      'psql',
      ['-w', '-X', '-q', '-v', 'ON_ERROR_STOP=1', '--single-transaction', '--dbname', databaseName(databaseUrl),
        '-c', `DROP SCHEMA IF EXISTS ${APP_SCHEMAS.join(', ')} CASCADE`, '-c', 'CREATE SCHEMA public', '-f', script],
      databaseUrl,
    )
  } finally {
    fs.rmSync(path.dirname(script), { recursive: true, force: true })
  }

  let removed = 0
  if (manifest.objects && store) {
    const kept = new Set(manifest.objects.items.map((item) => `${store.keyPrefix}${item.key.slice(manifest.objects!.keyPrefix.length)}`))
    const extra: string[] = []
    let token: string | undefined
    do {
      const page = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: store.keyPrefix || undefined, ContinuationToken: token }))
      extra.push(...(page.Contents ?? []).map((object) => object.Key!).filter((key) => !kept.has(key)))
      token = page.NextContinuationToken
    } while (token)
    for (let start = 0; start < extra.length; start += 1000) {
      const batch = extra.slice(start, start + 1000)
      await store.client.send(new DeleteObjectsCommand({ Bucket: store.bucket, Delete: { Objects: batch.map((Key) => ({ Key })) } }))
      removed += batch.length
    }
  }
  return { manifest, written, removed }
}

try {
  const { folder } = parseArguments(process.argv.slice(2))
  const { manifest, written, removed } = await restore(folder)
  console.log(
    `restore: from ${folder} (made ${manifest.createdAt}): database restored, ` +
      (manifest.objects ? `${written} objects written back, ${removed} newer objects removed` : 'no stored files in the backup'),
  )
} catch (error) {
  console.error(`restore: ${(error instanceof Error ? error.message : String(error)).split('\n')[0]}`)
  process.exitCode = error instanceof UsageError ? 2 : 1
}
