import type { ModelStatic, Model, Transaction } from 'sequelize'

/**
 * A count of the writes that may change what the shop lists, kept for this process on globalThis
 * (Next.js loads server code in several bundles, each with its own copy of the models and of this
 * module; the count is one). What the shop keeps of its pages (lib/services/shop-listings.ts) is
 * good only while the count stands.
 */
const shared = globalThis as typeof globalThis & { wreathwrightListingChanges?: number }

/** The number of listing-changing writes this process has seen. */
export function listingChanges(): number {
  return shared.wreathwrightListingChanges ?? 0
}

/**
 * Counts a change of the shop made past the models' hooks (in plain SQL, e.g. a test emptying the
 * tables); inside a transaction, again when it commits.
 */
export function noteListingChange(options?: { transaction?: Transaction | null }): void {
  shared.wreathwrightListingChanges = listingChanges() + 1
  // Counted now and again once the transaction commits: a page read between the write and the
  // commit still sees the old rows, and must not outlive the commit.
  options?.transaction?.afterCommit(() => {
    shared.wreathwrightListingChanges = listingChanges() + 1
  })
}

const WRITE_HOOKS = ['afterCreate', 'afterUpdate', 'afterDestroy', 'afterUpsert', 'afterBulkCreate', 'afterBulkUpdate', 'afterBulkDestroy'] as const

/**
 * Counts every write through these models (a listing is made of patterns, their designers' names
 * and their covers) as a change of the shop, whoever makes it: a service, a seed script, a test
 * factory. A write in plain SQL bypasses the hooks; the shop then sees it once its kept page
 * expires (SHOP_PAGE_FRESH_MS).
 */
export function watchListingChanges(models: readonly ModelStatic<Model>[]): void {
  for (const model of models) {
    for (const hook of WRITE_HOOKS) {
      // One name per hook, so binding the models again (a second Sequelize instance) adds none.
      model.removeHook(hook, 'listing-changes')
      model.addHook(hook, 'listing-changes', (...args: unknown[]) => noteListingChange(args.at(-1) as { transaction?: Transaction | null }))
    }
  }
}
