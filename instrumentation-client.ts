/**
 * Runs in the browser before the app's own code (Next.js instrumentation-client). zod compiles
 * object schemas with `new Function` when it may, and finds out by trying once: under the pages'
 * Content-Security-Policy (no 'unsafe-eval', lib/security-headers.ts) that try is refused and
 * reported as a violation in every page that parses a form or an answer. jitless tells zod not to
 * try; in the browser its plain parser is fast enough for a form or a design. The server (no
 * policy there) keeps the compiled parsers.
 */
import { z } from 'zod'

z.config({ jitless: true })
