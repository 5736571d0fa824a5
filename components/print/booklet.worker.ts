/**
 * Builds a booklet off the main thread, so the print room stays responsive while a large one is
 * written. The same lib/booklet code as everywhere else; the bytes are handed back, not copied.
 * Messages: in, { id, design, options, swatches?, footer? }; out, { id, kind: 'page', page } while writing, then
 * { id, kind: 'done', file } or { id, kind: 'error', message }.
 */
import { buildBookletFile } from '@/lib/booklet/booklet'
import type { BuildReply, BuildRequest } from './booklet-builder'

const reply = (message: BuildReply, transfer: Transferable[] = []): void => self.postMessage(message, { transfer })

self.onmessage = (event: MessageEvent<BuildRequest>) => {
  const { id, design, options, swatches, footer } = event.data
  try {
    const file = buildBookletFile(design, options, { swatches, footer, onPage: (page) => reply({ id, kind: 'page', page }) })
    reply({ id, kind: 'done', file }, [file.bytes.buffer])
  } catch (error) {
    reply({ id, kind: 'error', message: error instanceof Error ? error.message : String(error) })
  }
}
