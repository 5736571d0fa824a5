/**
 * npm start — the built app as WEB_PROCESSES web processes sharing one port (default: one per
 * core). One Node.js process runs JavaScript on one core; a machine with more cores serves more by
 * running more processes, which is safe because no state that matters lives in a web process
 * (sessions, rate limits and queues are in PostgreSQL, files in the object store; see the README's
 * "Running on more than one machine"). Node's cluster module hands each new connection to the
 * processes in turn. A process that dies after it listened is started again a second later; one
 * that dies before (bad settings, the port taken, no build) stops them all with exit code 1.
 * SIGINT or SIGTERM stops them all.
 *
 * Arguments after the script go to `next start` unchanged, e.g. `--hostname 127.0.0.1 --port 3000`.
 */
import cluster from 'node:cluster'
import { createRequire } from 'node:module'
import os from 'node:os'

const requested = process.env.WEB_PROCESSES ?? String(os.availableParallelism())
const processes = Number(requested)
if (!Number.isInteger(processes) || processes < 1 || processes > 64) {
  console.error(`serve: WEB_PROCESSES must be a whole number from 1 to 64 (got ${requested})`)
  process.exit(2)
}
/** Between a process's death and its replacement, so a process that keeps dying does not spin. */
const RESTART_DELAY_MS = 1_000

const nextBin = createRequire(import.meta.url).resolve('next/dist/bin/next')
cluster.setupPrimary({ exec: nextBin, args: ['start', ...process.argv.slice(2)] })

let stopping = false
/** The live processes by cluster id, and whether each has listened yet. */
const live = new Map<number, { listened: boolean }>()

function stopAll(exitCode: number): void {
  stopping = true
  process.exitCode = exitCode
  for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill('SIGTERM')
  if (live.size === 0) process.exit(exitCode)
}

cluster.on('listening', (worker, address) => {
  live.set(worker.id, { listened: true })
  console.log(`serve: web process ${worker.process.pid} listening on ${address.address ?? '*'}:${address.port}`)
})
cluster.on('exit', (worker, code, signal) => {
  const listened = live.get(worker.id)?.listened ?? false
  live.delete(worker.id)
  if (stopping) {
    if (live.size === 0) process.exit()
    return
  }
  console.error(`serve: web process ${worker.process.pid} ended (${signal ?? `exit ${code}`})`)
  if (!listened) {
    // It never started (bad settings, the port taken, no build): another would fail the same way.
    console.error('serve: it ended before it could answer; stopping')
    stopAll(1)
    return
  }
  setTimeout(() => stopping || fork(), RESTART_DELAY_MS)
})
for (const signal of ['SIGINT', 'SIGTERM'] as const) process.on(signal, () => stopAll(0))

function fork(): void {
  live.set(cluster.fork().id, { listened: false })
}
for (let index = 0; index < processes; index++) fork()
