/**
 * A PostgreSQL cluster of our own, from Debian's packages, listening on 127.0.0.1 only.
 * The demo keeps one in the project (.data/); the test run makes a throwaway one in a temporary folder.
 */
import { execFileSync, spawnSync } from 'node:child_process'
import { createHash } from 'node:crypto'
import fs from 'node:fs'
import path from 'node:path'

const isRoot = process.getuid?.() === 0

function postgresBinaries(): string {
  const root = '/usr/lib/postgresql'
  const versions = fs.existsSync(root)
    ? fs.readdirSync(root).filter((name) => fs.existsSync(path.join(root, name, 'bin', 'initdb')))
    : []
  const newest = versions.sort((a, b) => Number(a) - Number(b)).at(-1)
  if (!newest) throw new Error('PostgreSQL is not installed (expected /usr/lib/postgresql/*/bin/initdb)')
  return path.join(root, newest, 'bin')
}

/** Runs a PostgreSQL binary, as the postgres user when we are root (initdb refuses root). */
function run(binary: string, args: string[], options: { quiet?: boolean } = {}): string {
  const file = path.join(postgresBinaries(), binary)
  const [command, commandArgs] = isRoot ? ['runuser', ['-u', 'postgres', '--', file, ...args]] : [file, args]
  const result = spawnSync(command, commandArgs, { cwd: '/', encoding: 'utf8' })
  if (result.status !== 0) {
    throw new Error(`${binary} failed (${result.status}): ${result.stderr || result.stdout}`)
  }
  if (!options.quiet && result.stderr.trim()) process.stderr.write(result.stderr)
  return result.stdout
}

/**
 * Can the postgres user reach a folder inside `parent`? It needs to pass through every folder above;
 * one under a 0700 folder such as /root cannot. (We create the data folder itself as root and hand
 * it to postgres, so postgres needs no write access to the parent.)
 */
function isReachableByPostgres(parent: string): boolean {
  if (!isRoot) return true
  return spawnSync('runuser', ['-u', 'postgres', '--', 'test', '-x', parent], { cwd: '/' }).status === 0
}

/**
 * Where a project-local cluster lives: `.data/postgres-<port>` inside the project, or, when the
 * postgres user cannot reach the project (root's home is 0700), a folder under /var/lib named after
 * the project's path and port.
 */
export function projectClusterFolder(projectRoot: string, port: number): string {
  const dataFolder = path.join(projectRoot, '.data')
  fs.mkdirSync(dataFolder, { recursive: true, mode: 0o755 })
  if (isReachableByPostgres(dataFolder)) return path.join(dataFolder, `postgres-${port}`)
  const tag = createHash('sha256').update(projectRoot).digest('hex').slice(0, 10)
  return path.join('/var/lib/wreathwright', `${tag}-${port}`)
}

export interface Cluster {
  readonly folder: string
  readonly port: number
  /** postgres://postgres@127.0.0.1:PORT/NAME */
  url(databaseName: string): string
  createDatabase(databaseName: string): void
  stop(): void
}

/** Whether a PostgreSQL server of this data folder is running (false when the folder holds no cluster). */
export function isClusterRunning(folder: string): boolean {
  if (!fs.existsSync(path.join(folder, 'PG_VERSION'))) return false
  const pgCtl = path.join(postgresBinaries(), 'pg_ctl')
  const status = spawnSync(isRoot ? 'runuser' : pgCtl, isRoot ? ['-u', 'postgres', '--', pgCtl, 'status', '-D', folder] : ['status', '-D', folder],
    { cwd: '/', encoding: 'utf8' })
  return status.status === 0
}

/** Creates the cluster if the folder holds none, then starts it (or finds it already running). */
export function startCluster(folder: string, port: number, options: { throwaway?: boolean } = {}): Cluster {
  fs.mkdirSync(folder, { recursive: true })
  if (isRoot) execFileSync('chown', ['postgres:postgres', folder])
  fs.chmodSync(folder, 0o700)
  if (!fs.existsSync(path.join(folder, 'PG_VERSION'))) {
    run('initdb', ['-D', folder, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'], { quiet: true })
  }
  if (!isClusterRunning(folder)) {
    // A throwaway test cluster need not survive a power cut, so it skips fsync for speed.
    const settings = `-p ${port} -c listen_addresses=127.0.0.1 -c unix_socket_directories=''${options.throwaway ? ' -c fsync=off' : ''}`
    run('pg_ctl', ['-w', '-t', '30', '-D', folder, '-l', path.join(folder, 'server.log'), '-o', settings, 'start'], {
      quiet: true,
    })
  }
  const url = (databaseName: string) => `postgres://postgres@127.0.0.1:${port}/${databaseName}`
  return {
    folder,
    port,
    url,
    createDatabase(databaseName) {
      const exists = run('psql', ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-tAc',
        `SELECT 1 FROM pg_database WHERE datname = '${databaseName.replace(/'/g, "''")}'`], { quiet: true })
      if (exists.trim() !== '1') run('createdb', ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', databaseName])
    },
    stop() {
      run('pg_ctl', ['-w', '-D', folder, '-m', 'fast', 'stop'], { quiet: true })
    },
  }
}
