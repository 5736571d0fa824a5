/**
 * The project's PostgreSQL clusters ask for a password: a new one refuses a connection without the
 * generated password, and one made before passwords (trust) is switched over when it next starts.
 * These start real clusters from Debian's packages (about 2 s each) in a temporary folder.
 */
import fs from 'node:fs'
import os from 'node:os'
import path from 'node:path'
import pg from 'pg'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { freePort } from './processes'
import { requirePasswords, startCluster, type Cluster } from './postgres'

/** initdb and starts take seconds each, more on a busy machine. */
const CLUSTER_TIMEOUT = 60_000
let work: string
const clusters: Cluster[] = []

beforeAll(() => {
  work = fs.mkdtempSync(path.join(os.tmpdir(), 'wreathwright-postgres-test-'))
  // The postgres user (when we are root) must pass through to the cluster folders inside.
  fs.chmodSync(work, 0o755)
})
afterAll(() => {
  for (const cluster of clusters) {
    try {
      cluster.stop()
    } catch {
      // Already stopped by the test.
    }
  }
  fs.rmSync(work, { recursive: true, force: true })
}, CLUSTER_TIMEOUT)

/** Connects and runs `SELECT 1`; resolves to the error when the server refuses. */
async function tryConnect(url: string): Promise<Error | 'connected'> {
  const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 5_000 })
  try {
    await client.connect()
    await client.query('SELECT 1')
    return 'connected'
  } catch (error) {
    return error as Error
  } finally {
    await client.end().catch(() => undefined)
  }
}

/** A URL for the same database with the password replaced (or removed, with ''). */
function withPassword(url: string, password: string): string {
  const copy = new URL(url)
  copy.password = password
  return copy.toString()
}

describe('a new cluster', () => {
  it('refuses connections without its generated password, kept in a file only its owner reads', async () => {
    const passwordFile = path.join(work, 'new.password')
    const cluster = startCluster(path.join(work, 'new'), await freePort(), { throwaway: true, passwordFile })
    clusters.push(cluster)
    cluster.createDatabase('wreathwright_check')
    const password = fs.readFileSync(passwordFile, 'utf8').trim()
    // 32 random bytes in base64url (RFC 4648 §5) are 43 characters.
    expect(password).toMatch(/^[A-Za-z0-9_-]{43}$/)
    expect(fs.statSync(passwordFile).mode & 0o777).toBe(0o600)

    const url = cluster.url('wreathwright_check')
    expect(new URL(url).password).toBe(password)
    expect(await tryConnect(url)).toBe('connected')
    // SQLSTATE 28P01 invalid_password (PostgreSQL manual, Appendix A): the server checked and refused.
    const wrong = await tryConnect(withPassword(url, 'not-the-password'))
    expect(wrong).toBeInstanceOf(Error)
    expect((wrong as Error & { code?: string }).code).toBe('28P01')
    const empty = await tryConnect(withPassword(url, ''))
    expect(empty).toBeInstanceOf(Error)
    const hba = fs.readFileSync(path.join(cluster.folder, 'pg_hba.conf'), 'utf8')
    expect(hba).not.toMatch(/^\s*(local|host)\S*\s.*\strust\s*$/m)
  }, CLUSTER_TIMEOUT)
})

describe('a cluster made before passwords', () => {
  it('gets the password and the check when it next starts, and says so', async () => {
    const folder = path.join(work, 'old')
    const port = await freePort()
    const passwordFile = path.join(work, 'old.password')
    // Make a cluster, then put it back as the scripts used to leave it: every local user trusted,
    // and no password file in the project.
    startCluster(folder, port, { throwaway: true, passwordFile }).stop()
    const hbaFile = path.join(folder, 'pg_hba.conf')
    const hba = fs.readFileSync(hbaFile, 'utf8')
    fs.writeFileSync(hbaFile, hba.replace(/\sscram-sha-256(\s*)$/gm, ' trust$1'))
    expect(fs.readFileSync(hbaFile, 'utf8')).toMatch(/^host\s+all\s+all\s+127\.0\.0\.1\/32\s+trust$/m)
    fs.rmSync(passwordFile)

    const messages: string[] = []
    const write = console.error
    console.error = (message: string) => messages.push(message)
    let cluster: Cluster
    try {
      cluster = startCluster(folder, port, { throwaway: true, passwordFile })
    } finally {
      console.error = write
    }
    clusters.push(cluster)
    expect(messages.join('\n')).toContain('now asks for the one in')
    const url = cluster.url('postgres')
    expect(await tryConnect(url)).toBe('connected')
    expect(((await tryConnect(withPassword(url, 'guess'))) as Error & { code?: string }).code).toBe('28P01')
    expect(fs.readFileSync(hbaFile, 'utf8')).not.toMatch(/\strust\s*$/m)
  }, CLUSTER_TIMEOUT)

  it('is refused plainly when its password file is lost', async () => {
    const folder = path.join(work, 'lost')
    const port = await freePort()
    const passwordFile = path.join(work, 'lost.password')
    const cluster = startCluster(folder, port, { throwaway: true, passwordFile })
    clusters.push(cluster)
    fs.rmSync(passwordFile)
    expect(() => startCluster(folder, port, { throwaway: true, passwordFile })).toThrow(/refused the password .* the file was lost/)
    // The password made for the attempt is not left behind to be mistaken for the cluster's.
    expect(fs.existsSync(passwordFile)).toBe(false)
  }, CLUSTER_TIMEOUT)
})

describe('requirePasswords', () => {
  it('turns every trust line of an initdb pg_hba.conf into scram-sha-256 and leaves comments alone', () => {
    // The lines initdb --auth=trust writes (PostgreSQL 15), with its comment about trust.
    const hba = [
      '# CAUTION: Configuring the system for local "trust" authentication',
      'local   all             all                                     trust',
      'host    all             all             127.0.0.1/32            trust',
      'host    all             all             ::1/128                 trust',
      'local   replication     all                                     trust',
      'host    replication     all             127.0.0.1/32            trust',
    ].join('\n')
    const lines = requirePasswords(hba).split('\n')
    expect(lines[0]).toBe('# CAUTION: Configuring the system for local "trust" authentication')
    expect(lines.slice(1).every((line) => line.endsWith(' scram-sha-256'))).toBe(true)
    expect(lines[2]).toBe('host    all             all             127.0.0.1/32            scram-sha-256')
  })
})
