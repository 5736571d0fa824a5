import pg from 'pg'
import type { Model, ModelStatic, Sequelize, Transaction } from 'sequelize'

/**
 * Answers kept in a web process, and how it hears that they changed.
 *
 * The signed-in reads that `npm run load` measures (a session on every request, a pattern, a
 * sewing plan) cost mostly their round trips to PostgreSQL. A web process therefore keeps what it
 * read (KeptAnswers) and drops it the moment a row it was made from changes anywhere: triggers
 * (migration 20261203-0180) send `NOTIFY row_changes, '<table>:<id>'` at commit, and each web
 * process listens on one connection of its own (RowChangeFeed). Writes this process makes through
 * the models drop their answers at once as well (noteWritesOf), so a person always reads their own
 * writes on the instance that made them; on another instance, an answer may be stale for as long
 * as the notice takes to arrive (about a millisecond on one machine).
 *
 * Nothing is kept unless the feed is live: not before it first listens, not from the moment its
 * connection breaks (every kept answer is dropped then: notices may have been missed) until it
 * listens again; and a process that never starts it (tests, scripts) keeps nothing.
 */

/** The channel the triggers notify on. */
export const ROW_CHANGE_CHANNEL = 'row_changes'

/** A tag: `<table>:<id>` (one row's notices), `<table>:*` (any row of the table), or `*` (everything). */
export type ChangeTag = string

/**
 * The longest any answer is kept, heard changes or not (our choice): a guard against a change no
 * trigger saw (a restore that switched triggers off), short enough that it shows for minutes, not
 * days, and long enough that answers kept in one burst (a sale's first minute) do not all fall due
 * in another.
 */
export const KEPT_AT_MOST_MS = 10 * 60_000

/** How many recent changes the feed remembers by tag, to refuse answers read while one happened. */
const REMEMBERED_CHANGES = 50_000

/** The first and the longest wait before listening again after the connection broke. */
const RECONNECT_FIRST_MS = 250
const RECONNECT_AT_MOST_MS = 5_000

const tableOf = (tag: ChangeTag) => tag.slice(0, tag.indexOf(':'))

/**
 * The change notices of this process. One per process (`rowChanges()`), shared by every copy of
 * the modules Next.js bundles (it lives on globalThis).
 */
export class RowChangeFeed {
  /** Whether notices are heard now: kept answers are used and kept only then. */
  live = false
  /** Counts every change heard or made here and every loss of the feed. */
  private generation = 0
  private readonly lastChange = new Map<ChangeTag, number>()
  /** Answers begun before this generation are refused: the changes before it were forgotten. */
  private floor = 0
  private readonly listeners = new Set<(tag: ChangeTag) => void>()
  private client: pg.Client | null = null
  private started = false
  private stopped = false
  private retryMs = RECONNECT_FIRST_MS
  private retryTimer: NodeJS.Timeout | null = null

  /** Listens on `databaseUrl` (the primary: notices are not sent to read replicas) until `stop()`. */
  start(databaseUrl: string): void {
    if (this.started) return
    this.started = true
    this.stopped = false
    void this.connect(databaseUrl)
  }

  async stop(): Promise<void> {
    this.stopped = true
    this.started = false
    if (this.retryTimer) clearTimeout(this.retryTimer)
    this.lose()
    const client = this.client
    this.client = null
    await client?.end().catch(() => undefined)
  }

  private async connect(databaseUrl: string): Promise<void> {
    const client = new pg.Client({ connectionString: databaseUrl, application_name: 'wreathwright-row-changes' })
    this.client = client
    const broken = (error?: Error) => {
      if (this.client !== client) return
      this.client = null
      this.lose()
      client.end().catch(() => undefined)
      if (this.stopped) return
      if (error) console.error(`row changes: the listening connection broke (${error.message}); kept answers are not used until it listens again`)
      this.retryTimer = setTimeout(() => void this.connect(databaseUrl), this.retryMs)
      this.retryTimer.unref()
      this.retryMs = Math.min(this.retryMs * 2, RECONNECT_AT_MOST_MS)
    }
    client.on('error', broken)
    client.on('end', () => broken())
    client.on('notification', (message) => {
      if (message.channel === ROW_CHANGE_CHANNEL && message.payload) this.changed(message.payload)
    })
    try {
      await client.connect()
      await client.query(`LISTEN ${ROW_CHANGE_CHANNEL}`)
    } catch (error) {
      if (this.client === client) broken(error as Error)
      else await client.end().catch(() => undefined)
      return
    }
    // Stopped (or started again) while this connection was being opened: it is not needed.
    if (this.client !== client) {
      await client.end().catch(() => undefined)
      return
    }
    // Whatever was kept before may have changed unheard.
    this.changed('*')
    this.retryMs = RECONNECT_FIRST_MS
    this.live = true
  }

  /** The feed stopped hearing: nothing kept may be trusted, and nothing is kept until it hears again. */
  private lose(): void {
    this.live = false
    this.changed('*')
  }

  /** The current generation, to pass to `changedSince` after reading. */
  now(): number {
    return this.generation
  }

  /** Whether any of `tags` (or its whole table, or everything) changed after generation `since`. */
  changedSince(tags: readonly ChangeTag[], since: number): boolean {
    if (since < this.floor || (this.lastChange.get('*') ?? 0) > since) return true
    return tags.some((tag) => (this.lastChange.get(tag) ?? 0) > since || (this.lastChange.get(`${tableOf(tag)}:*`) ?? 0) > since)
  }

  /** A change heard from PostgreSQL or made by this process: the answers made from it are dropped. */
  changed(tag: ChangeTag): void {
    this.generation += 1
    this.lastChange.delete(tag)
    this.lastChange.set(tag, this.generation)
    if (this.lastChange.size > REMEMBERED_CHANGES) {
      this.lastChange.clear()
      this.floor = this.generation
    }
    for (const listener of this.listeners) listener(tag)
  }

  /** Calls `listener` with every change's tag; answers the function that stops it. */
  subscribe(listener: (tag: ChangeTag) => void): () => void {
    this.listeners.add(listener)
    return () => this.listeners.delete(listener)
  }
}

const globalForChanges = globalThis as typeof globalThis & { wreathwrightRowChanges?: RowChangeFeed }

/** This process's feed (started by instrumentation.ts in a web process, by nothing elsewhere). */
export function rowChanges(): RowChangeFeed {
  globalForChanges.wreathwrightRowChanges ??= new RowChangeFeed()
  return globalForChanges.wreathwrightRowChanges
}

/** What a maker of an answer gives back: the answer, the rows it was made from (null: do not keep it) and when it goes stale by itself. */
export interface MadeAnswer<V> {
  readonly value: V
  readonly tags: readonly ChangeTag[] | null
  /** When the answer stops being true without any row changing (an invitation's expiry, a session's end). */
  readonly until?: Date | null
}

/**
 * Answers kept by key until a row they were made from changes, for at most KEPT_AT_MOST_MS, the
 * oldest dropped first beyond `budget` (counted by `weigh`, one per answer by default). A kept
 * value is shared by every reader: never change it.
 */
export class KeptAnswers<V> {
  private readonly entries = new Map<string, { value: V; tags: readonly ChangeTag[]; until: number; weight: number }>()
  private readonly keysByTag = new Map<ChangeTag, Set<string>>()
  private weight = 0

  constructor(
    private readonly budget: number,
    private readonly weigh: (value: V) => number = () => 1,
    private readonly feed: RowChangeFeed = rowChanges(),
  ) {
    feed.subscribe((tag) => this.dropTag(tag))
  }

  /** The kept answer for `key`, or `make`'s, kept when the feed is live and nothing it was made from changed meanwhile. */
  async answer(key: string, make: () => Promise<MadeAnswer<V>>): Promise<V> {
    const kept = this.feed.live ? this.entries.get(key) : undefined
    if (kept && kept.until > Date.now()) return kept.value
    const begun = this.feed.now()
    const made = await make()
    if (made.tags && this.feed.live && !this.feed.changedSince(made.tags, begun)) this.keep(key, made)
    return made.value
  }

  /** How many answers are kept (tests). */
  get size(): number {
    return this.entries.size
  }

  private keep(key: string, made: MadeAnswer<V>): void {
    const until = Math.min(Date.now() + KEPT_AT_MOST_MS, made.until?.getTime() ?? Infinity)
    const weight = this.weigh(made.value)
    if (weight > this.budget || until <= Date.now()) return
    this.drop(key)
    this.entries.set(key, { value: made.value, tags: made.tags!, until, weight })
    this.weight += weight
    for (const tag of made.tags!) {
      const keys = this.keysByTag.get(tag) ?? new Set<string>()
      keys.add(key)
      this.keysByTag.set(tag, keys)
    }
    for (const oldest of this.entries.keys()) {
      if (this.weight <= this.budget) break
      this.drop(oldest)
    }
  }

  private drop(key: string): void {
    const entry = this.entries.get(key)
    if (!entry) return
    this.entries.delete(key)
    this.weight -= entry.weight
    for (const tag of entry.tags) {
      const keys = this.keysByTag.get(tag)
      keys?.delete(key)
      if (keys?.size === 0) this.keysByTag.delete(tag)
    }
  }

  private dropTag(tag: ChangeTag): void {
    if (tag === '*') {
      this.entries.clear()
      this.keysByTag.clear()
      this.weight = 0
    } else if (tag.endsWith(':*')) {
      const table = tableOf(tag)
      for (const [kept, keys] of [...this.keysByTag]) if (tableOf(kept) === table) for (const key of [...keys]) this.drop(key)
    } else {
      for (const key of [...(this.keysByTag.get(tag) ?? [])]) this.drop(key)
    }
  }
}

/**
 * The tags a write to each table's rows sends, as `[tag's table, column]` pairs: the triggers'
 * arguments (migration 20261203-0180, which a migration may not import), for this process's own
 * writes through the models.
 */
const TAGS_OF_TABLE: Record<string, readonly (readonly [string, string])[]> = {
  sessions: [['sessions', 'id']],
  users: [['users', 'id']],
  patterns: [['patterns', 'id']],
  pattern_invitations: [['pattern_invitations', 'id'], ['patterns', 'pattern_id']],
  licences: [['licences', 'id']],
  sewing_projects: [['sewing_projects', 'id']],
  sewing_steps: [['sewing_projects', 'project_id']],
}

/**
 * The tags of a write to `model`'s rows with these attribute values (a row's, or an update's or
 * delete's `where`): one row's tag where the value names one row, else the whole table's.
 */
function tagsOfWrite(model: ModelStatic<Model>, valueOf: (attribute: string) => unknown): ChangeTag[] {
  const pairs = TAGS_OF_TABLE[model.getTableName() as string] ?? []
  const attributes = Object.entries(model.getAttributes())
  return pairs.map(([table, column]) => {
    const attribute = attributes.find(([, definition]) => (definition.field ?? '') === column)?.[0]
    const value = attribute ? valueOf(attribute) : undefined
    return typeof value === 'string' || typeof value === 'number' ? `${table}:${value}` : `${table}:*`
  })
}

/**
 * Tells this process's feed about a write: at once, and again once its transaction commits (a read
 * between the two could otherwise keep the old row).
 */
export function noteWrite(tags: readonly ChangeTag[], transaction?: Transaction | null): void {
  const feed = rowChanges()
  const tell = () => {
    for (const tag of tags) feed.changed(tag)
  }
  tell()
  transaction?.afterCommit(tell)
}

/** Makes every write through `sequelize`'s models drop this process's answers made from its rows (see the top of this file). */
export function noteWritesOf(sequelize: Sequelize): void {
  type Options = { transaction?: Transaction | null; model?: ModelStatic<Model>; where?: unknown }
  const ofInstance = (instance: Model, options: Options) => {
    const model = instance.constructor as ModelStatic<Model>
    if (TAGS_OF_TABLE[model.getTableName() as string]) noteWrite(tagsOfWrite(model, (attribute) => instance.get(attribute)), options.transaction)
  }
  const ofBulk = (options: Options) => {
    if (options.model && TAGS_OF_TABLE[options.model.getTableName() as string]) noteWrite(tagsOfWrite(options.model, (attribute) => (options.where as Record<string, unknown> | undefined)?.[attribute]), options.transaction)
  }
  sequelize.addHook('afterCreate', ofInstance)
  sequelize.addHook('afterUpdate', ofInstance)
  sequelize.addHook('afterDestroy', ofInstance)
  sequelize.addHook('afterBulkCreate', (_instances: Model[], options: Options) => ofBulk({ ...options, where: undefined }))
  sequelize.addHook('afterBulkUpdate', ofBulk)
  sequelize.addHook('afterBulkDestroy', ofBulk)
  sequelize.addHook('afterUpsert', (_result: unknown, options: Options) => ofBulk({ ...options, where: undefined }))
}
