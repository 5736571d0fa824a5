import { afterEach, describe, expect, it, vi } from 'vitest'
import { bookletOptionsSchema } from '@/lib/schemas/booklet'
import { designFrom, wreathFile } from '@/lib/booklet/test-support/designs'
import { BuildCancelled, createBookletBuilder, type BuildReply, type BuildRequest } from './booklet-builder'

/** A stand-in for the browser's Worker: records what it is sent and answers when told. */
class FakeWorker {
  static made: FakeWorker[] = []
  static failOnStart = false
  onmessage: ((event: MessageEvent<BuildReply>) => void) | null = null
  onerror: ((event: ErrorEvent) => void) | null = null
  readonly sent: BuildRequest[] = []
  terminated = false
  constructor(readonly url: URL, readonly options: WorkerOptions) {
    FakeWorker.made.push(this)
  }
  postMessage(request: BuildRequest): void {
    this.sent.push(request)
    if (FakeWorker.failOnStart) {
      queueMicrotask(() => this.onerror?.({ message: 'could not load', preventDefault: () => undefined } as ErrorEvent))
    }
  }
  terminate(): void {
    this.terminated = true
  }
  reply(message: BuildReply): void {
    this.onmessage?.({ data: message } as MessageEvent<BuildReply>)
  }
}

const design = designFrom(wreathFile())
const options = bookletOptionsSchema.parse({ paper: 'letter' })
const file = { bytes: new Uint8Array([37, 80, 68, 70]), pages: [], tilings: [] }

afterEach(() => {
  vi.unstubAllGlobals()
  FakeWorker.made = []
  FakeWorker.failOnStart = false
})

describe('the booklet builder', () => {
  it('builds in a worker, passing the page progress on', async () => {
    vi.stubGlobal('Worker', FakeWorker)
    const builder = createBookletBuilder()
    const heard: number[] = []
    const built = builder.build(design, options, (page) => heard.push(page))
    const worker = FakeWorker.made[0]!
    expect(worker.url.pathname).toMatch(/booklet\.worker\.ts$/)
    const { id } = worker.sent[0]!
    worker.reply({ id, kind: 'page', page: 1 })
    worker.reply({ id, kind: 'page', page: 2 })
    worker.reply({ id, kind: 'done', file })
    await expect(built).resolves.toEqual({ ...file, builtIn: 'worker' })
    expect(heard).toEqual([1, 2])
    builder.dispose()
    expect(worker.terminated).toBe(true)
  })

  it('stops the build under way when another is asked for, and answers only the newer one', async () => {
    vi.stubGlobal('Worker', FakeWorker)
    const builder = createBookletBuilder()
    const older = builder.build(design, options, () => undefined)
    const first = FakeWorker.made[0]!
    const newer = builder.build(design, { ...options, paper: 'a4' }, () => undefined)
    await expect(older).rejects.toBeInstanceOf(BuildCancelled)
    // A synchronous build cannot be interrupted: its worker is ended and a fresh one started.
    expect(first.terminated).toBe(true)
    const second = FakeWorker.made[1]!
    expect(second.sent[0]!.options.paper).toBe('a4')
    second.reply({ id: second.sent[0]!.id, kind: 'done', file })
    await expect(newer).resolves.toMatchObject({ builtIn: 'worker' })
    builder.dispose()
  })

  it('builds on the main thread when the worker cannot start', async () => {
    vi.stubGlobal('Worker', FakeWorker)
    FakeWorker.failOnStart = true
    vi.spyOn(console, 'warn').mockImplementation(() => undefined)
    const builder = createBookletBuilder()
    const built = await builder.build(design, options, () => undefined)
    expect(built.builtIn).toBe('main thread')
    expect(new TextDecoder().decode(built.bytes.slice(0, 5))).toBe('%PDF-')
    expect(built.pages.length).toBeGreaterThan(1)
    // Later builds go straight to the main thread.
    await builder.build(design, options, () => undefined)
    expect(FakeWorker.made).toHaveLength(1)
  })
})
