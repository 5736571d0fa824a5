/** Small process helpers shared by the demo and the test runner. */
import { spawn, type ChildProcess } from 'node:child_process'
import net from 'node:net'

/** A TCP port on 127.0.0.1 that nothing listens on right now. */
export function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer()
    server.once('error', reject)
    server.listen(0, '127.0.0.1', () => {
      const address = server.address()
      server.close(() => (typeof address === 'object' && address ? resolve(address.port) : reject(new Error('no port'))))
    })
  })
}

/** Whether something already listens on this port of 127.0.0.1. */
export function isPortTaken(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: '127.0.0.1', port })
    socket.once('connect', () => (socket.destroy(), resolve(true)))
    socket.once('error', () => resolve(false))
  })
}

/** Runs a command with inherited output; resolves to its exit code. */
export function run(command: string, args: string[], env: NodeJS.ProcessEnv = process.env): Promise<number> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { stdio: 'inherit', env })
    child.once('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)))
    child.once('error', () => resolve(127))
  })
}

/** Starts a long-running process in its own process group so that it can be stopped with its children. */
export function startProcess(command: string, args: string[], env: NodeJS.ProcessEnv, options: { quiet?: boolean } = {}): ChildProcess {
  return spawn(command, args, { env, detached: true, stdio: options.quiet ? ['ignore', 'ignore', 'inherit'] : 'inherit' })
}

export function stopProcess(child: ChildProcess | undefined): Promise<void> {
  if (!child || child.exitCode !== null || child.pid === undefined) return Promise.resolve()
  return new Promise((resolve) => {
    const timer = setTimeout(() => {
      try {
        process.kill(-child.pid!, 'SIGKILL')
      } catch {
        // The group ended by itself between the timer and the kill: nothing left to stop.
      }
    }, 5_000)
    child.once('exit', () => (clearTimeout(timer), resolve()))
    try {
      process.kill(-child.pid!, 'SIGTERM')
    } catch {
      clearTimeout(timer)
      resolve()
    }
  })
}

/** Polls a URL until it answers 200, or fails after `timeoutMs`. */
export async function waitForHttp(url: string, timeoutMs = 60_000): Promise<void> {
  const deadline = Date.now() + timeoutMs
  let last = 'no answer'
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url)
      if (response.ok) return
      last = `HTTP ${response.status}`
    } catch (error) {
      last = error instanceof Error ? error.message : String(error)
    }
    await new Promise((resolve) => setTimeout(resolve, 250))
  }
  throw new Error(`${url} did not come up within ${timeoutMs / 1000} s (${last})`)
}
