/**
 * npm run backup -- <folder>
 *
 * Copies everything Wreathwright keeps into a new folder: the database (pg_dump, custom format,
 * from Debian's PostgreSQL client of the newest installed version) and every object of the object
 * store under S3_KEY_PREFIX (through the S3 SDK), with a manifest of sizes and SHA-256 sums
 * (scripts/backup-folder.ts). Reads the app's settings: DATABASE_URL and S3_*. The app may keep
 * running: the dump is one consistent snapshot; an upload made while the objects are copied may be
 * in the store without its row, or the reverse (see `npm run restore`).
 *
 * Errors: one line on stderr; exit 2 for bad arguments, 1 when the backup failed (the unfinished
 * folder is then removed).
 */
import fs from 'node:fs'
import path from 'node:path'
import { GetObjectCommand, ListObjectsV2Command } from '@aws-sdk/client-s3'
import {
  backupSources,
  DATABASE_FILE,
  databaseName,
  MANIFEST_FILE,
  OBJECTS_FOLDER,
  runPostgresProgram,
  sha256,
  sha256OfFile,
  type Manifest,
  type ManifestObject,
} from './backup-folder'
import { UsageError } from './command-arguments'

const USAGE = 'usage: npm run backup -- <new folder>'

function parseArguments(args: readonly string[]): { folder: string } {
  const options = args.filter((arg) => arg.startsWith('-'))
  if (options.length > 0) throw new UsageError(`unknown option ${options[0]}; ${USAGE}`)
  if (args.length !== 1) throw new UsageError(args.length === 0 ? USAGE : `expected one folder, got ${args.length}; ${USAGE}`)
  const folder = path.resolve(args[0]!)
  if (fs.existsSync(folder) && (!fs.statSync(folder).isDirectory() || fs.readdirSync(folder).length > 0)) {
    throw new UsageError(`${args[0]} already exists and is not an empty folder; back up into a new one`)
  }
  return { folder }
}

async function backUp(folder: string): Promise<Manifest> {
  const { databaseUrl, store } = backupSources()
  fs.mkdirSync(path.join(folder, OBJECTS_FOLDER), { recursive: true, mode: 0o700 })
  fs.chmodSync(folder, 0o700)

  const dumpFile = path.join(folder, DATABASE_FILE)
  const serverVersion = (await runPostgresProgram('psql', ['-w', '-X', '-tAc', 'SHOW server_version'], databaseUrl)).trim()
  await runPostgresProgram('pg_dump', ['-w', '--format=custom', '--file', dumpFile], databaseUrl)
  const database = { file: DATABASE_FILE, bytes: fs.statSync(dumpFile).size, sha256: await sha256OfFile(dumpFile), name: databaseName(databaseUrl), serverVersion }

  let objects: Manifest['objects'] = null
  if (store) {
    const items: ManifestObject[] = []
    let token: string | undefined
    do {
      const page = await store.client.send(new ListObjectsV2Command({ Bucket: store.bucket, Prefix: store.keyPrefix || undefined, ContinuationToken: token }))
      for (const listed of page.Contents ?? []) {
        const key = listed.Key!
        const answer = await store.client.send(new GetObjectCommand({ Bucket: store.bucket, Key: key }))
        const bytes = await answer.Body!.transformToByteArray()
        const file = path.join(OBJECTS_FOLDER, String(items.length + 1).padStart(6, '0'))
        fs.writeFileSync(path.join(folder, file), bytes, { mode: 0o600 })
        items.push({ key, file, bytes: bytes.byteLength, sha256: sha256(bytes), contentType: answer.ContentType ?? null })
      }
      token = page.NextContinuationToken
    } while (token)
    objects = { bucket: store.bucket, keyPrefix: store.keyPrefix, items }
  }

  const manifest: Manifest = { format: 'wreathwright-backup', version: 1, createdAt: new Date().toISOString(), database, objects }
  // Written last: a folder with a manifest is a finished backup.
  fs.writeFileSync(path.join(folder, MANIFEST_FILE), `${JSON.stringify(manifest, null, 2)}\n`, { mode: 0o600 })
  return manifest
}

let folder: string | undefined
let madeFolder = false
try {
  folder = parseArguments(process.argv.slice(2)).folder
  madeFolder = !fs.existsSync(folder)
  const manifest = await backUp(folder)
  const objectCount = manifest.objects?.items.length ?? 0
  const objectBytes = manifest.objects?.items.reduce((sum, item) => sum + item.bytes, 0) ?? 0
  console.log(
    `backup: ${folder}: database ${manifest.database.name} (${manifest.database.bytes} bytes), ` +
      (manifest.objects ? `${objectCount} objects (${objectBytes} bytes) from bucket ${manifest.objects.bucket}` : 'no object store configured'),
  )
} catch (error) {
  const usage = error instanceof UsageError
  console.error(`backup: ${(error instanceof Error ? error.message : String(error)).split('\n')[0]}`)
  // An unfinished backup must not pass for one.
  if (!usage && folder) {
    if (madeFolder) fs.rmSync(folder, { recursive: true, force: true })
    else for (const entry of fs.readdirSync(folder)) fs.rmSync(path.join(folder, entry), { recursive: true, force: true })
  }
  process.exitCode = usage ? 2 : 1
}
