/**
 * Large bodies from strangers: while a few clients keep sending 10 MB bodies to
 * `POST /api/patterns` without a session (each refused with 413 before it is read), how long the
 * health check takes. Prints its median and 99th percentile, quiet and under that load.
 * Goal (issue 10): the health check's 99th percentile stays at or under 100 ms.
 *
 * Starts its own throwaway PostgreSQL and the built app, like the test runner. Traffic goes to
 * 127.0.0.1 only and stops by itself (a fixed number of health checks, at most LOAD_SECONDS).
 */
import net from 'node:net'
import { percentile, startBenchApp } from './bench-app'

const BODY_BYTES = 10 * 1024 * 1024
/** Clients sending large bodies at the same time, each one after the other without pause. */
const SENDERS = 4
const HEALTH_CHECKS = 400
const LOAD_SECONDS = 60

/** Sends one large body as an attacker would, writing it whole unless the server answers or closes first. */
function sendLargeBody(base: URL): Promise<number> {
  const piece = Buffer.alloc(64 * 1024, 'x')
  return new Promise((resolve) => {
    let received = ''
    let written = 0
    let done = false
    const socket = net.connect({ host: base.hostname, port: Number(base.port) })
    const finish = (status: number) => {
      if (done) return
      done = true
      socket.destroy()
      resolve(status)
    }
    socket.setTimeout(30_000, () => finish(0))
    socket.on('data', (data) => {
      received += data.toString('latin1')
      const match = /^HTTP\/1\.1 (\d{3})/.exec(received)
      if (match) finish(Number(match[1]))
    })
    socket.on('error', () => finish(0))
    socket.on('close', () => finish(0))
    // One piece at a time, reading between pieces as a browser does, so an early answer is read.
    const writeBody = () => {
      if (done || written >= BODY_BYTES) return
      written += piece.byteLength
      if (socket.write(piece)) setImmediate(writeBody)
      else socket.once('drain', writeBody)
    }
    socket.once('connect', () => {
      socket.write(
        [`POST /api/patterns HTTP/1.1`, `Host: ${base.host}`, `Origin: ${base.origin}`, 'Content-Type: application/json', `Content-Length: ${BODY_BYTES}`, '', ''].join('\r\n'),
      )
      writeBody()
    })
  })
}

async function timeHealthChecks(base: URL, count: number): Promise<number[]> {
  const times: number[] = []
  for (let i = 0; i < count; i += 1) {
    const started = performance.now()
    const response = await fetch(new URL('/api/health', base))
    await response.arrayBuffer()
    times.push(performance.now() - started)
    await new Promise((resolve) => setTimeout(resolve, 10))
  }
  return times
}

const summary = (times: number[]) => {
  const sorted = [...times].sort((a, b) => a - b)
  return `median ${percentile(sorted, 50).toFixed(1)} ms, 99th percentile ${percentile(sorted, 99).toFixed(1)} ms, worst ${sorted.at(-1)!.toFixed(1)} ms`
}

const bench = await startBenchApp({ demoData: false })
try {
  const base = new URL(bench.base)
  await timeHealthChecks(base, 50) // warm-up
  const quiet = await timeHealthChecks(base, HEALTH_CHECKS)

  const statuses = new Map<number, number>()
  const deadline = Date.now() + LOAD_SECONDS * 1000
  let loading = true
  const senders = Array.from({ length: SENDERS }, async () => {
    while (loading && Date.now() < deadline) {
      const status = await sendLargeBody(base)
      statuses.set(status, (statuses.get(status) ?? 0) + 1)
    }
  })
  const loaded = await timeHealthChecks(base, HEALTH_CHECKS)
  loading = false
  await Promise.all(senders)

  const answered = [...statuses].map(([status, count]) => `${count} × ${status === 0 ? 'no answer' : status}`).join(', ')
  console.log(`health check while ${SENDERS} strangers keep sending 10 MB bodies to POST /api/patterns:`)
  console.log(`  quiet:        ${summary(quiet)}`)
  console.log(`  under load:   ${summary(loaded)}`)
  console.log(`  large bodies: ${answered}`)
  console.log('  goal: 99th percentile under load ≤ 100 ms; every large body answered 413')
} finally {
  await bench.stop()
}
