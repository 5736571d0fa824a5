/**
 * `npm run backup` and `npm run restore` (scripts/backup.ts, scripts/restore.ts) round trip: data
 * made through the app (patterns with revisions, uploads in the object store) is backed up,
 * changed and deleted, restored, and then every row of every table and every object of the
 * bucket is compared with what was there at the backup, byte for byte. Also: the command line's
 * refusals, and a damaged backup that changes nothing.
 */
import { spawn } from 'node:child_process'
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import { DeleteObjectCommand, GetObjectCommand, PutObjectCommand, type S3Client } from '@aws-sdk/client-s3'
import sharp from 'sharp'
import { QueryTypes } from 'sequelize'
import { afterAll, beforeEach, describe, expect, it } from 'vitest'
import { PATCH as updatePattern } from '@/app/api/patterns/[id]/route'
import { POST as postUpload } from '@/app/api/uploads/route'
import { database } from '@/lib/db'
import { objectStoreSettings } from '@/lib/env'
import { s3ClientFor } from '@/lib/s3-client'
import { emptyDesign } from '@/lib/new-design'
import { Pattern, Upload, User } from '@/models'
import { hollyberryWreath } from '@/scripts/demo-wreath'
import { closeDatabase, freshDatabase } from '../support/database'
import { createPatternRow, createUser, sessionCookieFor } from '../support/factories'
import { emptyBucket, storedKeys } from '../support/object-store'
import { call, TEST_ORIGIN } from '../support/requests'

const workFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-backup-test-'))

beforeEach(async () => {
  await freshDatabase()
  await emptyBucket()
})
afterAll(async () => {
  await closeDatabase()
  fs.rmSync(workFolder, { recursive: true, force: true })
})

/** Runs `npm run backup` / `npm run restore` as a person would, with the app's settings. */
function runScript(script: 'backup' | 'restore', args: string[]): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn('npx', ['tsx', `scripts/${script}.ts`, ...args], { env: process.env, stdio: ['ignore', 'pipe', 'pipe'] })
    let stdout = ''
    let stderr = ''
    child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()))
    child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()))
    child.once('error', reject)
    child.once('exit', (code) => resolve({ code, stdout, stderr }))
  })
}

function s3(): { client: S3Client; bucket: string } {
  const settings = objectStoreSettings()!
  const client = s3ClientFor(settings)
  return { client, bucket: settings.bucket }
}

/** Every object of the bucket: key → its bytes (hex) and content type. */
async function objectsNow(): Promise<Record<string, { hex: string; contentType: string | undefined }>> {
  const { client, bucket } = s3()
  const result: Record<string, { hex: string; contentType: string | undefined }> = {}
  for (const key of (await storedKeys()).sort()) {
    const answer = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }))
    result[key] = { hex: Buffer.from(await answer.Body!.transformToByteArray()).toString('hex'), contentType: answer.ContentType }
  }
  return result
}

/** Every row of every table (each row as PostgreSQL's text of it, sorted) and every sequence's position. */
async function rowsNow(): Promise<Record<string, string[] | number>> {
  const sequelize = database()
  const tables = await sequelize.query<{ name: string }>(
    `SELECT format('%I.%I', table_schema, table_name) AS name FROM information_schema.tables
      WHERE table_type = 'BASE TABLE' AND table_schema NOT IN ('pg_catalog', 'information_schema') ORDER BY 1`,
    { type: QueryTypes.SELECT },
  )
  const result: Record<string, string[] | number> = {}
  for (const { name } of tables) {
    const rows = await sequelize.query<{ row: string }>(`SELECT t::text AS row FROM ${name} t ORDER BY 1`, { type: QueryTypes.SELECT })
    result[name] = rows.map((row) => row.row)
  }
  const sequences = await sequelize.query<{ name: string }>(
    `SELECT format('%I.%I', schemaname, sequencename) AS name FROM pg_sequences ORDER BY 1`,
    { type: QueryTypes.SELECT },
  )
  for (const { name } of sequences) {
    const [position] = await sequelize.query<{ value: string | null }>(`SELECT last_value::text AS value FROM ${name}`, { type: QueryTypes.SELECT })
    result[`sequence ${name}`] = Number(position?.value ?? 0)
  }
  return result
}

async function photo(colour: { r: number; g: number; b: number }): Promise<Uint8Array> {
  return new Uint8Array(await sharp({ create: { width: 64, height: 48, channels: 3, background: colour } }).png().toBuffer())
}

async function upload(cookie: string, bytes: Uint8Array): Promise<string> {
  const headers = new Headers({ origin: TEST_ORIGIN, 'content-type': 'image/png', cookie })
  const request = new Request(`${TEST_ORIGIN}/api/uploads?kind=fabric-photo`, { method: 'POST', headers, body: new Blob([new Uint8Array(bytes)]) })
  const response = await postUpload(request)
  expect(response.status).toBe(201)
  return ((await response.json()) as { upload: { id: string } }).upload.id
}

async function save(cookie: string, id: string, body: Record<string, unknown>) {
  const answer = await call(updatePattern, { method: 'PATCH', path: `/api/patterns/${id}`, cookie, params: { id }, body })
  expect(answer.status).toBe(200)
}

/** A designer with two patterns (one saved twice) and two uploaded photos, plus an object of no row. */
async function seed() {
  const designer = await createUser({ roles: ['designer', 'quilter'], displayName: 'Rowan Ash' })
  const cookie = await sessionCookieFor(designer)
  const star = await createPatternRow(designer, { name: 'Winter Star', design: emptyDesign('Winter Star') })
  await save(cookie, star.id, { revision: 1, design: { ...hollyberryWreath, name: 'Winter Star' } })
  await save(cookie, star.id, { revision: 2, name: 'Winter Star II' })
  const moss = await createPatternRow(designer, { name: 'Moss Ring' })
  const firstPhoto = await upload(cookie, await photo({ r: 180, g: 40, b: 60 }))
  await upload(cookie, await photo({ r: 30, g: 120, b: 70 }))
  const { client, bucket } = s3()
  await client.send(new PutObjectCommand({ Bucket: bucket, Key: 'notes/readme.txt', Body: 'kept as it is\n', ContentType: 'text/plain' }))
  return { designer, cookie, star, moss, firstPhoto }
}

describe('npm run backup, then npm run restore', () => {
  it('brings back every row and every stored object, byte for byte, after changes and deletions', async () => {
    const { designer, cookie, star, moss, firstPhoto } = await seed()
    const rowsAtBackup = await rowsNow()
    const objectsAtBackup = await objectsNow()
    expect(Object.keys(objectsAtBackup)).toHaveLength(3)

    const folder = path.join(workFolder, 'round-trip')
    const backup = await runScript('backup', [folder])
    expect(backup.stderr).toBe('')
    expect(backup.code).toBe(0)
    expect(backup.stdout).toMatch(/3 objects/)
    const manifest = JSON.parse(fs.readFileSync(path.join(folder, 'manifest.json'), 'utf8')) as { objects: { items: { key: string }[] } }
    expect(manifest.objects.items.map((item) => item.key).sort()).toEqual(Object.keys(objectsAtBackup))

    // Life goes on: a save, a deleted pattern, a deleted photo (row and object), a new photo and person.
    await save(cookie, star.id, { revision: 3, name: 'Winter Star III' })
    await Pattern.destroy({ where: { id: moss.id } })
    const gone = await Upload.findByPk(firstPhoto)
    await Upload.destroy({ where: { id: firstPhoto } })
    const { client, bucket } = s3()
    await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: gone!.key }))
    await client.send(new PutObjectCommand({ Bucket: bucket, Key: 'notes/readme.txt', Body: 'overwritten\n', ContentType: 'text/plain' }))
    await upload(cookie, await photo({ r: 20, g: 20, b: 200 }))
    await createUser({ displayName: 'After The Backup' })
    expect(await rowsNow()).not.toEqual(rowsAtBackup)
    expect(await objectsNow()).not.toEqual(objectsAtBackup)

    const restored = await runScript('restore', [folder, '--yes'])
    expect(restored.stderr).toBe('')
    expect(restored.code).toBe(0)
    expect(restored.stdout).toMatch(/3 objects written back, 1 newer objects removed/)

    expect(await rowsNow()).toEqual(rowsAtBackup)
    expect(await objectsNow()).toEqual(objectsAtBackup)
    // And the app reads it as before, on its own pool.
    expect((await Pattern.findByPk(star.id))?.name).toBe('Winter Star II')
    expect(await Pattern.findByPk(moss.id)).not.toBeNull()
    expect(await User.count({ where: { id: designer.id } })).toBe(1)
  })

  it('changes nothing when the backup is damaged', async () => {
    await seed()
    const folder = path.join(workFolder, 'damaged')
    expect((await runScript('backup', [folder])).code).toBe(0)
    await createUser({ displayName: 'After The Backup' })
    const rowsBefore = await rowsNow()
    const objectsBefore = await objectsNow()
    const objectFile = path.join(folder, 'objects', '000001')
    const bytes = fs.readFileSync(objectFile)
    bytes.writeUInt8(bytes.readUInt8(bytes.length - 1) ^ 0xff, bytes.length - 1)
    fs.writeFileSync(objectFile, bytes)

    const restored = await runScript('restore', [folder, '--yes'])
    expect(restored.code).toBe(2)
    expect(restored.stderr).toMatch(/^restore: the backup is damaged: objects\/000001 does not match/)
    expect(restored.stderr.trim().split('\n')).toHaveLength(1)
    expect(await rowsNow()).toEqual(rowsBefore)
    expect(await objectsNow()).toEqual(objectsBefore)
  })

  it('refuses bad arguments with one line and exit 2', async () => {
    const used = path.join(workFolder, 'used')
    fs.mkdirSync(used, { recursive: true })
    fs.writeFileSync(path.join(used, 'something'), 'x')
    const cases: [('backup' | 'restore'), string[], RegExp][] = [
      ['backup', [], /^backup: usage: npm run backup -- <new folder>$/],
      ['backup', [used], /^backup: .*used already exists and is not an empty folder/],
      ['backup', ['--everything', path.join(workFolder, 'new')], /^backup: unknown option --everything/],
      ['restore', [], /^restore: usage: npm run restore -- <backup folder> --yes$/],
      ['restore', [used], /^restore: restoring replaces the database and the stored files; add --yes/],
      ['restore', [used, '--yes'], /^restore: .*used has no manifest.json: not a finished backup$/],
      ['restore', [path.join(workFolder, 'missing'), '--yes', '--fast'], /^restore: unknown option --fast/],
    ]
    for (const [script, args, message] of cases) {
      const result = await runScript(script, args)
      expect(result.code, `${script} ${args.join(' ')}`).toBe(2)
      expect(result.stderr.trim().split('\n'), `${script} ${args.join(' ')}`).toHaveLength(1)
      expect(result.stderr.trim()).toMatch(message)
      expect(result.stdout).toBe('')
    }
    expect(fs.existsSync(path.join(workFolder, 'new'))).toBe(false)
  })
})
