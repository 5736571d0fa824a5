import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import type { DesignFile } from '@/lib/schemas/design'
import { createAutosaver, RETRY_DELAYS_MS, type Autosaver } from './autosave'
import { draftKey, findRecoverableDraft, isSameDesign, type DraftStorage } from './local-draft'
import { createBoardStore, type BoardStore } from './store'

const PATTERN_ID = '00000000-0000-4000-8000-000000000001'

/** A saved pattern's design: the empty ring every new pattern starts as, with overrides. */
const design = (overrides: Partial<DesignFile> = {}): DesignFile => ({ ...emptyDesign('Winter Star'), ...overrides })

interface Sent {
  readonly method: string
  readonly body: { revision: number; design: DesignFile } | null
  readonly keepalive: boolean
}

/**
 * The pattern API as the server behaves: a PATCH from an older revision is refused with 409 and
 * writes nothing. `hold()` keeps answers back until `release()`, to see a request in flight.
 */
function fakeServer(start: { revision: number; design: DesignFile }) {
  const server = {
    revision: start.revision,
    design: start.design,
    offline: false,
    invalid: false,
    sent: [] as Sent[],
    held: [] as (() => void)[],
    holding: false,
    hold() {
      server.holding = true
    },
    /** Answers the requests held so far; later ones are held too until `resume()`. */
    release() {
      for (const answer of server.held.splice(0)) answer()
    },
    resume() {
      server.holding = false
      server.release()
    },
    /** Someone else saves the pattern. */
    saveElsewhere(next: DesignFile) {
      server.revision += 1
      server.design = next
    },
  }
  const json = (status: number, body: unknown) => new Response(JSON.stringify(body), { status, headers: { 'content-type': 'application/json' } })
  const answer = (method: string, body: Sent['body']): Response => {
    if (method === 'GET') return json(200, { pattern: { id: PATTERN_ID, revision: server.revision, design: server.design } })
    if (server.invalid) return json(422, { error: { message: 'invalid', issues: [{ path: 'design.ring.repeats', message: 'Too big' }] } })
    if (body!.revision !== server.revision) {
      return json(409, { error: { message: 'saved elsewhere', currentRevision: server.revision } })
    }
    server.revision += 1
    server.design = body!.design
    return json(200, { pattern: { id: PATTERN_ID, revision: server.revision, design: server.design } })
  }
  const fetch = vi.fn((_input: RequestInfo | URL, init?: RequestInit): Promise<Response> => {
    if (server.offline) return Promise.reject(new TypeError('Failed to fetch'))
    const method = init?.method ?? 'GET'
    const body = init?.body ? (JSON.parse(String(init.body)) as Sent['body']) : null
    server.sent.push({ method, body, keepalive: init?.keepalive === true })
    if (!server.holding) return Promise.resolve(answer(method, body))
    return new Promise((resolve) => server.held.push(() => resolve(answer(method, body))))
  })
  return { server, fetch: fetch as unknown as typeof globalThis.fetch }
}

function memoryStorage(): DraftStorage & { items: Map<string, string> } {
  const items = new Map<string, string>()
  return {
    items,
    getItem: (key) => items.get(key) ?? null,
    setItem: (key, value) => void items.set(key, value),
    removeItem: (key) => void items.delete(key),
  }
}

interface Setup {
  readonly store: BoardStore
  readonly autosaver: Autosaver
  readonly server: ReturnType<typeof fakeServer>['server']
  readonly storage: ReturnType<typeof memoryStorage>
  readonly patches: () => Sent[]
}

function setup({ revision = 1, storage = memoryStorage() } = {}): Setup {
  const saved = design()
  const { server, fetch } = fakeServer({ revision, design: saved })
  const store = createBoardStore(saved)
  const autosaver = createAutosaver({ patternId: PATTERN_ID, revision, store, fetch, storage })
  autosaver.start()
  return { store, autosaver, server, storage, patches: () => server.sent.filter((request) => request.method === 'PATCH') }
}

const repeats = (store: BoardStore) => store.getState().history.present.ring.repeats

beforeEach(() => {
  vi.useFakeTimers()
})
afterEach(() => {
  vi.useRealTimers()
})

describe('saving after the quiet time', () => {
  it('saves once, a second after the last change, from the revision it last saw', async () => {
    const { store, autosaver, patches } = setup()
    store.run('setRing', { repeats: 6 })
    expect(autosaver.getState().status).toBe('unsaved')
    await vi.advanceTimersByTimeAsync(500)
    store.run('setRing', { repeats: 8 })
    await vi.advanceTimersByTimeAsync(999)
    expect(patches()).toHaveLength(0)
    await vi.advanceTimersByTimeAsync(1)
    expect(patches()).toHaveLength(1)
    expect(patches()[0]!.body).toMatchObject({ revision: 1, design: { ring: { repeats: 8 } } })
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 2 })
    expect(autosaver.getState().lastSavedAt).not.toBeNull()
  })

  it('never saves in the middle of a drag, and saves the drag once it ends', async () => {
    const { store, autosaver, patches } = setup()
    store.beginDrag()
    store.run('setRing', { outerRadius: 9.5 })
    store.run('setRing', { outerRadius: 10 })
    await vi.advanceTimersByTimeAsync(10_000)
    expect(patches()).toHaveLength(0)
    expect(autosaver.getState().status).toBe('unsaved')
    store.endDrag()
    await vi.advanceTimersByTimeAsync(1_000)
    expect(patches()).toHaveLength(1)
    expect(patches()[0]!.body?.design.ring.outerRadius).toBe(10)
  })

  it('keeps one request in flight and sends the changes made meanwhile together afterwards', async () => {
    const { store, autosaver, server, patches } = setup()
    server.hold()
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState().status).toBe('saving')
    store.run('setRing', { repeats: 8 })
    store.run('setRing', { repeats: 10 })
    await vi.advanceTimersByTimeAsync(5_000)
    expect(patches()).toHaveLength(1)
    server.resume()
    await vi.advanceTimersByTimeAsync(0)
    expect(patches()).toHaveLength(2)
    expect(patches()[1]!.body).toMatchObject({ revision: 2, design: { ring: { repeats: 10 } } })
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 3 })
  })

  it('makes no empty revision when a change leaves the design as it was', async () => {
    const { store, autosaver, patches } = setup()
    store.run('setRing', { repeats: 4 })
    await vi.advanceTimersByTimeAsync(2_000)
    expect(patches()).toHaveLength(0)
    expect(autosaver.getState().status).toBe('saved')
  })

  it('ignores view, tool and selection changes', async () => {
    const { store, autosaver, patches } = setup()
    store.chooseTool('seam')
    store.panBy(50, 0)
    store.toggleSide()
    await vi.advanceTimersByTimeAsync(2_000)
    expect(patches()).toHaveLength(0)
    expect(autosaver.getState().status).toBe('saved')
  })
})

describe('a conflict with a save made elsewhere', () => {
  async function conflicted() {
    const setupResult = setup()
    const { store, server } = setupResult
    server.saveElsewhere(design({ ring: { innerRadius: 0, outerRadius: 9, repeats: 12, repeatMode: 'rotate' } }))
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    return setupResult
  }

  it('stops saving on 409 until the designer chooses, keeping the draft', async () => {
    const { store, autosaver, server, storage, patches } = await conflicted()
    expect(autosaver.getState()).toMatchObject({ status: 'conflict', conflictRevision: 2, revision: 1 })
    store.run('setRing', { repeats: 8 })
    await vi.advanceTimersByTimeAsync(60_000)
    expect(patches()).toHaveLength(1)
    expect(server.design.ring.repeats).toBe(12)
    const draft = JSON.parse(storage.items.get(draftKey(PATTERN_ID))!) as { baseRevision: number; design: DesignFile }
    expect(draft).toMatchObject({ baseRevision: 1, design: { ring: { repeats: 8 } } })
  })

  it('saves on top without asking when only the pattern was renamed elsewhere', async () => {
    const { store, autosaver, server, patches } = setup()
    // A rename on the shelf makes a new revision with the same design.
    server.saveElsewhere(server.design)
    store.run('setRing', { repeats: 8 })
    await vi.advanceTimersByTimeAsync(1_000)
    await vi.advanceTimersByTimeAsync(10)
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 3, conflictRevision: null })
    expect(patches().map((request) => request.body!.revision)).toEqual([1, 2])
    expect(server.design.ring.repeats).toBe(8)
  })

  it('reloads theirs as one undo step and adopts their revision', async () => {
    const { store, autosaver, server, storage, patches } = await conflicted()
    await autosaver.reloadTheirs()
    expect(repeats(store)).toBe(12)
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 2, conflictRevision: null })
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
    await vi.advanceTimersByTimeAsync(5_000)
    expect(patches()).toHaveLength(1)
    // Ours is one undo away; undoing is a change like any other, saved on top of theirs.
    store.undo()
    expect(repeats(store)).toBe(6)
    await vi.advanceTimersByTimeAsync(1_000)
    expect(patches()[1]!.body).toMatchObject({ revision: 2, design: { ring: { repeats: 6 } } })
    expect(server.revision).toBe(3)
  })

  it('keeps mine as a new revision on top of theirs', async () => {
    const { store, autosaver, server, storage } = await conflicted()
    await autosaver.keepMine()
    const sent = server.sent.slice(-2)
    expect(sent.map((request) => request.method)).toEqual(['GET', 'PATCH'])
    expect(sent[1]!.body).toMatchObject({ revision: 2, design: { ring: { repeats: 6 } } })
    expect(server).toMatchObject({ revision: 3, design: { ring: { repeats: 6 } } })
    expect(repeats(store)).toBe(6)
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 3, conflictRevision: null })
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
  })

  it('stays in conflict when yet another save lands between reading and keeping mine', async () => {
    const { autosaver, server } = await conflicted()
    const fetchSpy = server.sent.length
    server.hold()
    const keeping = autosaver.keepMine()
    expect(autosaver.getState().resolving).toBe(true)
    server.release() // the GET answers revision 2 …
    await vi.advanceTimersByTimeAsync(0)
    server.saveElsewhere(design({ name: 'Someone else again' })) // … then revision 3 lands
    server.resume()
    await keeping
    expect(server.sent.length - fetchSpy).toBe(2)
    expect(autosaver.getState()).toMatchObject({ status: 'conflict', conflictRevision: 3, resolving: false })
    expect(server.design.name).toBe('Someone else again')
  })
})

describe('failures', () => {
  it('retries after a network error, later and later, and recovers', async () => {
    const { store, autosaver, server, patches } = setup()
    server.offline = true
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState()).toMatchObject({ status: 'error', problem: 'Could not reach Wreathwright.' })
    expect(autosaver.getState().retryAt).toBe(Date.now() + RETRY_DELAYS_MS[0]!)
    await vi.advanceTimersByTimeAsync(RETRY_DELAYS_MS[0]!)
    expect(server.sent).toHaveLength(0)
    expect(autosaver.getState().retryAt).toBe(Date.now() + RETRY_DELAYS_MS[1]!)
    server.offline = false
    await vi.advanceTimersByTimeAsync(RETRY_DELAYS_MS[1]!)
    expect(patches()).toHaveLength(1)
    expect(autosaver.getState()).toMatchObject({ status: 'saved', problem: null, retryAt: null, revision: 2 })
  })

  it('retries at once when asked', async () => {
    const { store, autosaver, server } = setup()
    server.offline = true
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    server.offline = false
    await autosaver.retryNow()
    expect(autosaver.getState()).toMatchObject({ status: 'saved', revision: 2 })
  })

  it('does not resend a design the server refused, but tries again after the next change', async () => {
    const { store, autosaver, server, patches } = setup()
    server.invalid = true
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState().status).toBe('error')
    expect(autosaver.getState().problem).toContain('design.ring.repeats: Too big')
    await vi.advanceTimersByTimeAsync(60_000)
    expect(patches()).toHaveLength(1)
    server.invalid = false
    store.run('setRing', { repeats: 8 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState()).toMatchObject({ status: 'saved', problem: null })
  })
})

describe('the local draft', () => {
  it('is written on every change and cleared once the server has the design', async () => {
    const { store, storage } = setup()
    store.run('setRing', { repeats: 6 })
    const draft = JSON.parse(storage.items.get(draftKey(PATTERN_ID))!) as Record<string, unknown>
    expect(draft).toMatchObject({ patternId: PATTERN_ID, baseRevision: 1, design: { ring: { repeats: 6 } } })
    expect(Number.isNaN(Date.parse(String(draft.savedAt)))).toBe(false)
    await vi.advanceTimersByTimeAsync(1_000)
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
  })

  it('is cleared when undo returns to the saved design', async () => {
    const { store, autosaver, storage, patches } = setup()
    store.run('setRing', { repeats: 6 })
    store.undo()
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
    expect(autosaver.getState().status).toBe('saved')
    await vi.advanceTimersByTimeAsync(2_000)
    expect(patches()).toHaveLength(0)
  })

  it('is written on leave, and the pending change goes out with keepalive', () => {
    const { store, autosaver, storage, patches } = setup()
    store.run('setRing', { repeats: 6 })
    storage.items.clear()
    autosaver.flushOnLeave()
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(true)
    expect(patches()).toHaveLength(1)
    expect(patches()[0]!.keepalive).toBe(true)
  })

  it('only writes the draft on leave in the middle of a drag', async () => {
    const { store, autosaver, storage, patches } = setup()
    store.beginDrag()
    store.run('setRing', { outerRadius: 10 })
    autosaver.flushOnLeave()
    await vi.advanceTimersByTimeAsync(0)
    expect(patches()).toHaveLength(0)
    expect(storage.items.get(draftKey(PATTERN_ID))).toContain('"outerRadius":10')
  })
})

describe('recovering a draft after a crash', () => {
  const stored = (revision: number, of: DesignFile) =>
    JSON.stringify({ patternId: PATTERN_ID, baseRevision: revision, savedAt: '2026-12-01T10:00:00.000Z', design: of })

  it('finds a draft that says something other than the saved design', () => {
    const storage = memoryStorage()
    const saved = design()
    expect(findRecoverableDraft(storage, PATTERN_ID, saved)).toBeNull()
    storage.items.set(draftKey(PATTERN_ID), stored(1, design({ name: 'Winter Star, reworked' })))
    expect(findRecoverableDraft(storage, PATTERN_ID, saved)).toMatchObject({ baseRevision: 1, design: { name: 'Winter Star, reworked' } })
  })

  it('offers no draft that matches the saved design, even with the optional lists left out', () => {
    const storage = memoryStorage()
    const { fills: _fills, leaves: _leaves, order: _order, ...sparse } = design()
    storage.items.set(draftKey(PATTERN_ID), stored(1, design()))
    expect(findRecoverableDraft(storage, PATTERN_ID, sparse as DesignFile)).toBeNull()
    expect(isSameDesign(sparse as DesignFile, design())).toBe(true)
  })

  it('offers no draft that is damaged or not a valid design', () => {
    const storage = memoryStorage()
    storage.items.set(draftKey(PATTERN_ID), '{"design": ')
    expect(findRecoverableDraft(storage, PATTERN_ID, design())).toBeNull()
    storage.items.set(draftKey(PATTERN_ID), stored(1, { ...design(), ring: { innerRadius: 5, outerRadius: 1, repeats: 4, repeatMode: 'rotate' } }))
    expect(findRecoverableDraft(storage, PATTERN_ID, design())).toBeNull()
  })

  it('keeps the old draft until the designer answers, then restores it as a change to save', async () => {
    const storage = memoryStorage()
    storage.items.set(draftKey(PATTERN_ID), stored(1, design({ ring: { innerRadius: 0, outerRadius: 9, repeats: 16, repeatMode: 'rotate' } })))
    const { store, autosaver, patches } = setup({ storage })
    expect(autosaver.getState().recoverableDraft?.design.ring.repeats).toBe(16)
    // Work done before answering is saved, but does not overwrite the old draft.
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(storage.items.get(draftKey(PATTERN_ID))).toContain('"repeats":16')
    autosaver.restoreDraft()
    expect(repeats(store)).toBe(16)
    expect(autosaver.getState().recoverableDraft).toBeNull()
    await vi.advanceTimersByTimeAsync(1_000)
    expect(patches().at(-1)!.body).toMatchObject({ revision: 2, design: { ring: { repeats: 16 } } })
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
  })

  it('forgets the draft when the designer discards it', () => {
    const storage = memoryStorage()
    storage.items.set(draftKey(PATTERN_ID), stored(1, design({ name: 'Lost idea' })))
    const { store, autosaver } = setup({ storage })
    autosaver.discardDraft()
    expect(autosaver.getState().recoverableDraft).toBeNull()
    expect(storage.items.has(draftKey(PATTERN_ID))).toBe(false)
    expect(store.getState().history.present.name).toBe('Winter Star')
  })

  it('tells subscribers when the state changes', async () => {
    const { store, autosaver } = setup()
    const seen: string[] = []
    autosaver.subscribe(() => seen.push(autosaver.getState().status))
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(seen).toEqual(['unsaved', 'saving', 'saved'])
  })
})

describe('two tabs of one pattern in the same browser', () => {
  it('never clears a draft another tab wrote after its own', async () => {
    const storage = memoryStorage()
    const saved = design()
    const { server, fetch } = fakeServer({ revision: 1, design: saved })
    const firstStore = createBoardStore(saved)
    const secondStore = createBoardStore(saved)
    createAutosaver({ patternId: PATTERN_ID, revision: 1, store: firstStore, fetch, storage }).start()
    const second = createAutosaver({ patternId: PATTERN_ID, revision: 1, store: secondStore, fetch, storage })
    second.start()
    firstStore.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(500)
    secondStore.run('setRing', { repeats: 8 })
    // The first tab's save lands; the second tab's draft must survive it.
    await vi.advanceTimersByTimeAsync(500)
    expect(server.revision).toBe(2)
    expect(storage.items.get(draftKey(PATTERN_ID))).toContain('"repeats":8')
    await vi.advanceTimersByTimeAsync(500)
    expect(second.getState().status).toBe('conflict')
    expect(storage.items.get(draftKey(PATTERN_ID))).toContain('"repeats":8')
  })
})

describe('one phase field', () => {
  it('walks waiting → saving → idle, and names failures, refusals and conflicts', async () => {
    const { store, autosaver, server } = setup()
    const phases: string[] = []
    autosaver.subscribe(() => phases.push(autosaver.getState().phase))
    store.run('setRing', { repeats: 6 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(phases).toEqual(['waiting', 'saving', 'idle'])
    server.offline = true
    store.run('setRing', { repeats: 8 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState()).toMatchObject({ phase: 'retrying', status: 'error' })
    server.offline = false
    server.invalid = true
    await autosaver.retryNow()
    expect(autosaver.getState()).toMatchObject({ phase: 'refused', status: 'error' })
    server.invalid = false
    server.saveElsewhere(design({ name: 'Elsewhere' }))
    store.run('setRing', { repeats: 10 })
    await vi.advanceTimersByTimeAsync(1_000)
    expect(autosaver.getState()).toMatchObject({ phase: 'conflict', status: 'conflict' })
    const reloading = autosaver.reloadTheirs()
    expect(autosaver.getState().phase).toBe('resolving')
    await reloading
    expect(autosaver.getState()).toMatchObject({ phase: 'idle', status: 'saved' })
  })
})
