/**
 * The authorization matrix (issue 17, items 1 and 2): every API route handler and method, and
 * every page, with what each role gets. tests/integration/authorization-matrix.test.ts calls the
 * handlers in this process; tests/e2e/page-access.test.ts opens the pages, and every API path
 * again for its headers, on the built app. Both walk the app folder and fail when a route, a
 * method or a page has no row here (or a row names one that is gone), so a new one cannot miss its
 * permission check, its headers, its cookie flags or its body limit.
 *
 * An API outcome is 'allowed' — the permission step let the caller through: 2xx, or a refusal of
 * the body or the state that only comes after it (400, 409, 415, 422; every request sends `{}` or
 * no body, so an allowed write is refused by its schema and changes nothing) — or the status of the
 * refusal: 401 for a stranger where a session is needed, 403 where the caller may see the thing but
 * not do this, 404 where they may not even see it (other designers' drafts, the admin desk, other
 * people's orders, projects and booklets: lib/authorization.ts `authorize`).
 */
import fs from 'node:fs'
import path from 'node:path'
import { BODY_LIMITS } from '@/lib/http'
import { MAX_UPLOAD_BYTES } from '@/lib/images'
import type { MatrixRole, World } from '../support/authorization-world'

export type ApiOutcome = 'allowed' | 401 | 403 | 404
export type Expectations = Record<MatrixRole, ApiOutcome>

export interface ApiEntry {
  readonly expect: Expectations
  /** The dynamic segments; a destructive allowed call gets a fresh row from `world.make`. */
  readonly params?: (world: World) => Record<string, string> | Promise<Record<string, string>>
  /** A query string the route reads before or in its permission step (an upload's kind, a download token). */
  readonly query?: (world: World) => string
  /** 'json': `{}` is sent; 'bytes': an empty raw body; 'none': no body. */
  readonly body: 'json' | 'bytes' | 'none'
  /** The route's largest body (lib/http.ts BODY_LIMITS or its own); null for a handler outside route(). */
  readonly limit: number | null
  /** The answer may be kept by caches (a public shop cover): no `no-store`. */
  readonly publicCache?: boolean
}

/** Everyone, signed in or not, gets through. */
const everyone: Expectations = { stranger: 'allowed', quilter: 'allowed', buyer: 'allowed', tester: 'allowed', owner: 'allowed', designer: 'allowed', admin: 'allowed' }
/** Anyone signed in. */
const signedIn: Expectations = { ...everyone, stranger: 401 }
/** The admin desk: found by admins only. */
const adminDesk: Expectations = { stranger: 401, quilter: 404, buyer: 404, tester: 404, owner: 404, designer: 404, admin: 'allowed' }
/** Designers and admins (their own patterns, sales, uploads for designs). */
const designers: Expectations = { stranger: 401, quilter: 403, buyer: 403, tester: 403, owner: 'allowed', designer: 'allowed', admin: 'allowed' }
/** Reading the pattern in testing: its owner, its tester, admins; others do not find it. */
const patternReaders: Expectations = { stranger: 401, quilter: 404, buyer: 404, tester: 'allowed', owner: 'allowed', designer: 404, admin: 'allowed' }
/** Changing the pattern in testing: its owner and admins; the tester sees it but may not (403). */
const patternWriters: Expectations = { ...patternReaders, tester: 403 }
/** The buyer's own things (booklet, project, licence): nobody else finds them, not even an admin. */
const buyerOnly: Expectations = { stranger: 401, quilter: 404, buyer: 'allowed', tester: 404, owner: 404, designer: 404, admin: 404 }

const form = BODY_LIMITS.form
const none = BODY_LIMITS.none
const design = BODY_LIMITS.design
const id = (key: 'patternId' | 'listedId' | 'reportId' | 'licenceId' | 'orderId' | 'projectId' | 'bookletId' | 'swatchId' | 'coverId' | 'personId') => (world: World) => ({ id: world[key] })

export const API_MATRIX: Record<string, ApiEntry> = {
  'POST /api/account/email/confirm': { expect: everyone, body: 'json', limit: form },
  'POST /api/account/email': { expect: signedIn, body: 'json', limit: form },
  'POST /api/account/password': { expect: signedIn, body: 'json', limit: form },
  'GET /api/account': { expect: signedIn, body: 'none', limit: none },
  'PATCH /api/account': { expect: signedIn, body: 'json', limit: form },
  'DELETE /api/account': { expect: signedIn, body: 'json', limit: form },
  'POST /api/account/sessions/end-others': { expect: signedIn, body: 'none', limit: none },
  'GET /api/admin/audit': { expect: adminDesk, body: 'none', limit: none },
  'POST /api/admin/designer-requests/:id': { expect: adminDesk, body: 'json', limit: form, params: id('personId') },
  'GET /api/admin/designer-requests': { expect: adminDesk, body: 'none', limit: none },
  'PATCH /api/admin/listings/:id': { expect: adminDesk, body: 'json', limit: form, params: id('listedId') },
  'GET /api/admin/mail': { expect: adminDesk, body: 'none', limit: none },
  // The admin's call answers 409 (the order was never paid through the provider), after the permission.
  'POST /api/admin/orders/:id/refund': { expect: adminDesk, body: 'none', limit: none, params: id('orderId') },
  'GET /api/admin/payments': { expect: adminDesk, body: 'none', limit: none },
  'PATCH /api/admin/users/:id': { expect: adminDesk, body: 'json', limit: form, params: id('personId') },
  'GET /api/admin/users': { expect: adminDesk, body: 'none', limit: none },
  'POST /api/auth/password-reset/confirm': { expect: everyone, body: 'json', limit: form },
  'POST /api/auth/password-reset': { expect: everyone, body: 'json', limit: form },
  'POST /api/auth/sign-in': { expect: everyone, body: 'json', limit: form },
  'POST /api/auth/sign-out': { expect: everyone, body: 'none', limit: none },
  'POST /api/auth/sign-up': { expect: everyone, body: 'json', limit: form },
  'POST /api/auth/verify-email/resend': { expect: signedIn, body: 'none', limit: none },
  'POST /api/auth/verify-email': { expect: everyone, body: 'json', limit: form },
  'GET /api/booklets/:id/download': { expect: buyerOnly, body: 'none', limit: none, params: id('bookletId'), query: (world) => `?token=${encodeURIComponent(world.bookletToken)}` },
  'GET /api/booklets/:id': { expect: buyerOnly, body: 'none', limit: none, params: id('bookletId') },
  // Outside route(): no session, no body read.
  'GET /api/health/bare': { expect: everyone, body: 'none', limit: null },
  'GET /api/health': { expect: everyone, body: 'none', limit: null },
  'GET /api/library/:id': { expect: buyerOnly, body: 'none', limit: none, params: id('licenceId') },
  'GET /api/library': { expect: signedIn, body: 'none', limit: none },
  'POST /api/licences/:id/booklets': { expect: buyerOnly, body: 'json', limit: form, params: id('licenceId') },
  'DELETE /api/patterns/:id/invitations/:invitationId': {
    expect: patternWriters, body: 'none', limit: none,
    params: async (world) => ({ id: world.patternId, invitationId: await world.make.invitation() }),
  },
  'GET /api/patterns/:id/invitations': { expect: patternWriters, body: 'none', limit: none, params: id('patternId') },
  'POST /api/patterns/:id/invitations': { expect: patternWriters, body: 'json', limit: form, params: id('patternId') },
  // The published pattern: only its owner and admins find it here (the buyer reads it through the library).
  'GET /api/patterns/:id/listing': { expect: { ...patternWriters, tester: 404 }, body: 'none', limit: none, params: id('listedId') },
  'PATCH /api/patterns/:id/listing': { expect: { ...patternWriters, tester: 404 }, body: 'json', limit: form, params: id('listedId') },
  'GET /api/patterns/:id/reports': { expect: patternReaders, body: 'none', limit: none, params: id('patternId') },
  // Only a tester files; the designer and admins read the pattern but may not file (403).
  'POST /api/patterns/:id/reports': { expect: { ...patternReaders, owner: 403, admin: 403 }, body: 'json', limit: form, params: id('patternId') },
  'GET /api/patterns/:id/revisions': { expect: patternReaders, body: 'none', limit: none, params: id('patternId') },
  'GET /api/patterns/:id': { expect: patternReaders, body: 'none', limit: none, params: id('patternId') },
  'PATCH /api/patterns/:id': { expect: patternWriters, body: 'json', limit: design, params: id('patternId') },
  'DELETE /api/patterns/:id': { expect: patternWriters, body: 'none', limit: none, params: async (world) => ({ id: await world.make.pattern() }) },
  'GET /api/patterns/:id/state-changes': { expect: patternWriters, body: 'none', limit: none, params: id('patternId') },
  'GET /api/patterns': { expect: designers, body: 'none', limit: none },
  'POST /api/patterns': { expect: designers, body: 'json', limit: design },
  'POST /api/reports/:id/messages': { expect: patternReaders, body: 'json', limit: form, params: id('reportId') },
  'GET /api/reports/:id': { expect: patternReaders, body: 'none', limit: none, params: id('reportId') },
  'PATCH /api/reports/:id': { expect: patternWriters, body: 'json', limit: form, params: id('reportId') },
  'GET /api/sales/csv': { expect: designers, body: 'none', limit: none },
  'GET /api/sales': { expect: designers, body: 'none', limit: none },
  'GET /api/sewing-room/projects/:id': { expect: buyerOnly, body: 'none', limit: none, params: id('projectId') },
  'DELETE /api/sewing-room/projects/:id': { expect: buyerOnly, body: 'none', limit: none, params: async (world) => ({ id: await world.make.project() }) },
  'PATCH /api/sewing-room/projects/:id/steps': { expect: buyerOnly, body: 'json', limit: form, params: id('projectId') },
  'GET /api/sewing-room/projects': { expect: signedIn, body: 'none', limit: none },
  'POST /api/sewing-room/projects': { expect: signedIn, body: 'json', limit: form },
  'POST /api/shop/checkout': { expect: signedIn, body: 'json', limit: form },
  'GET /api/shop/covers/:id': { expect: everyone, body: 'none', limit: none, params: id('coverId'), publicCache: true },
  'GET /api/shop/orders/:id': { expect: { ...buyerOnly, admin: 'allowed' }, body: 'none', limit: none, params: id('orderId') },
  'GET /api/shop/patterns/:id': { expect: everyone, body: 'none', limit: none, params: id('listedId') },
  'GET /api/shop/patterns': { expect: everyone, body: 'none', limit: none },
  // The owner's swatch: theirs and admins'; no tester's pattern uses it.
  'GET /api/uploads/:id/palette': { expect: { ...patternReaders, tester: 404 }, body: 'none', limit: none, params: id('swatchId') },
  'GET /api/uploads/:id': { expect: { ...patternReaders, tester: 404 }, body: 'none', limit: none, params: id('swatchId') },
  'GET /api/uploads': { expect: designers, body: 'none', limit: none, query: () => '?kind=swatch' },
  'POST /api/uploads': { expect: designers, body: 'bytes', limit: MAX_UPLOAD_BYTES, query: () => '?kind=swatch' },
  // A call without a valid signature is refused (400) by its handler: no session is asked for.
  'POST /api/webhooks/payments': { expect: everyone, body: 'bytes', limit: 64 * 1024 },
}

/**
 * What a page gives: 200; 'sign-in' (a redirect to /sign-in); 'denied' (the studio's redirect to
 * /?denied=1 for someone who is not a designer); 404 (the not-found page: the admin desk, or a
 * pattern, licence or project the person may not see); or a redirect to another page of the app.
 */
export type PageOutcome = 200 | 404 | 'sign-in' | 'denied' | { readonly redirect: string }
export interface PageEntry {
  readonly expect: Record<MatrixRole, PageOutcome>
  /** The page's address for this world (dynamic segments filled in, any query it needs). */
  readonly path: (world: World) => string
}

const open: Record<MatrixRole, PageOutcome> = { stranger: 200, quilter: 200, buyer: 200, tester: 200, owner: 200, designer: 200, admin: 200 }
const signedInPage: Record<MatrixRole, PageOutcome> = { ...open, stranger: 'sign-in' }
const adminPage: Record<MatrixRole, PageOutcome> = { stranger: 'sign-in', quilter: 404, buyer: 404, tester: 404, owner: 404, designer: 404, admin: 200 }
const studioPage: Record<MatrixRole, PageOutcome> = { stranger: 'sign-in', quilter: 'denied', buyer: 'denied', tester: 'denied', owner: 200, designer: 200, admin: 200 }
const ownPatternPage: Record<MatrixRole, PageOutcome> = { ...studioPage, designer: 404 }
const buyerPage: Record<MatrixRole, PageOutcome> = { stranger: 'sign-in', quilter: 404, buyer: 200, tester: 404, owner: 404, designer: 404, admin: 404 }

/** Keyed by the page's file under app/, as the walk finds it. */
export const PAGE_MATRIX: Record<string, PageEntry> = {
  '(account)/account/confirm-email/page.tsx': { expect: open, path: () => '/account/confirm-email' },
  '(account)/account/page.tsx': { expect: signedInPage, path: () => '/account' },
  '(account)/reset-password/new/page.tsx': { expect: open, path: () => '/reset-password/new' },
  '(account)/reset-password/page.tsx': { expect: open, path: () => '/reset-password' },
  '(account)/sign-in/page.tsx': { expect: open, path: () => '/sign-in' },
  '(account)/sign-up/page.tsx': { expect: open, path: () => '/sign-up' },
  '(account)/verify-email/page.tsx': { expect: open, path: () => '/verify-email' },
  '(admin)/admin/audit/page.tsx': { expect: adminPage, path: () => '/admin/audit' },
  '(admin)/admin/mail/page.tsx': { expect: adminPage, path: () => '/admin/mail' },
  '(admin)/admin/page.tsx': { expect: { ...adminPage, admin: { redirect: '/admin/users' } }, path: () => '/admin' },
  '(admin)/admin/payments/page.tsx': { expect: adminPage, path: () => '/admin/payments' },
  '(admin)/admin/requests/page.tsx': { expect: adminPage, path: () => '/admin/requests' },
  '(admin)/admin/users/page.tsx': { expect: adminPage, path: () => '/admin/users' },
  '(reports)/patterns/[id]/reports/page.tsx': {
    expect: { stranger: 'sign-in', quilter: 404, buyer: 404, tester: 200, owner: 200, designer: 404, admin: 200 },
    path: (world) => `/patterns/${world.patternId}/reports`,
  },
  '(sewing-room)/sewing-room/[id]/page.tsx': { expect: buyerPage, path: (world) => `/sewing-room/${world.projectId}` },
  '(sewing-room)/sewing-room/new/page.tsx': { expect: buyerPage, path: (world) => `/sewing-room/new?licence=${world.licenceId}` },
  '(sewing-room)/sewing-room/page.tsx': { expect: signedInPage, path: () => '/sewing-room' },
  '(shop)/library/[id]/print/page.tsx': { expect: buyerPage, path: (world) => `/library/${world.licenceId}/print` },
  '(shop)/library/page.tsx': { expect: signedInPage, path: () => '/library' },
  '(shop)/shop/[id]/page.tsx': { expect: open, path: (world) => `/shop/${world.listedId}` },
  '(shop)/shop/checkout/cancelled/page.tsx': { expect: signedInPage, path: (world) => `/shop/checkout/cancelled?order=${world.orderId}` },
  '(shop)/shop/checkout/done/page.tsx': { expect: signedInPage, path: (world) => `/shop/checkout/done?order=${world.orderId}` },
  '(shop)/shop/page.tsx': { expect: open, path: () => '/shop' },
  '(studio)/patterns/[id]/board/page.tsx': { expect: ownPatternPage, path: (world) => `/patterns/${world.patternId}/board` },
  '(studio)/patterns/[id]/fabric/page.tsx': { expect: ownPatternPage, path: (world) => `/patterns/${world.patternId}/fabric` },
  '(studio)/patterns/[id]/page.tsx': { expect: ownPatternPage, path: (world) => `/patterns/${world.patternId}` },
  '(studio)/patterns/[id]/print/page.tsx': { expect: ownPatternPage, path: (world) => `/patterns/${world.patternId}/print` },
  '(studio)/patterns/page.tsx': { expect: studioPage, path: () => '/patterns' },
  '(studio)/sales/page.tsx': { expect: studioPage, path: () => '/sales' },
  '(testing)/testing/[id]/page.tsx': {
    expect: { stranger: 'sign-in', quilter: 404, buyer: 404, tester: 200, owner: { redirect: '/patterns/' }, designer: 404, admin: { redirect: '/patterns/' } },
    path: (world) => `/testing/${world.patternId}`,
  },
  '(testing)/testing/page.tsx': { expect: signedInPage, path: () => '/testing' },
  'page.tsx': { expect: open, path: () => '/' },
}

export const APP_ROOT = path.resolve(import.meta.dirname, '../../app')
export const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'] as const

/** Every route file under app/api, as `{ file, url }` with `/api/patterns/:id` for `api/patterns/[id]`. */
export function routeFiles(): { file: string; url: string }[] {
  const folder = path.join(APP_ROOT, 'api')
  return (fs.readdirSync(folder, { recursive: true }) as string[])
    .filter((file) => /^route\.(ts|tsx|js|mjs)$/.test(path.basename(file)))
    .sort()
    .map((file) => ({ file: path.join(folder, file), url: '/api/' + path.dirname(file).split(path.sep).join('/').replace(/\[(\w+)\]/g, ':$1') }))
}

/**
 * The methods a route file exports, read from its text (`export const GET =`, `export function
 * GET(`, `export async function GET(`, `export { GET }`), for the e2e test, which cannot import
 * the handlers; the integration test imports them and compares.
 */
export function exportedMethods(file: string): string[] {
  const text = fs.readFileSync(file, 'utf8')
  return HTTP_METHODS.filter((method) =>
    new RegExp(`export\\s+(const|let|async\\s+function|function)\\s+${method}\\b|export\\s*\\{[^}]*\\b${method}\\b[^}]*\\}`).test(text),
  )
}

/** Every page file under app/, relative to it (`(shop)/shop/[id]/page.tsx`). */
export function pageFiles(): string[] {
  return (fs.readdirSync(APP_ROOT, { recursive: true }) as string[])
    .filter((file) => /^page\.(tsx|ts|jsx|js|mdx)$/.test(path.basename(file)))
    .map((file) => file.split(path.sep).join('/'))
    .sort()
}

/** Files under app/, lib/ and components/ that declare server actions ('use server'); there are none, and a new one must get rows here. */
export function serverActionFiles(): string[] {
  const root = path.resolve(APP_ROOT, '..')
  const found: string[] = []
  for (const top of ['app', 'lib', 'components']) {
    for (const file of fs.readdirSync(path.join(root, top), { recursive: true }) as string[]) {
      if (!/\.(ts|tsx|js|jsx|mjs)$/.test(file)) continue
      const text = fs.readFileSync(path.join(root, top, file), 'utf8')
      if (/^\s*['"]use server['"]/m.test(text)) found.push(`${top}/${file.split(path.sep).join('/')}`)
    }
  }
  return found.sort()
}
