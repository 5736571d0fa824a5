import type { PaperName } from '@/lib/schemas/booklet'

/** Paper sizes as people name them. */
export const PAPER_LABELS: Readonly<Record<PaperName, string>> & Readonly<Record<string, string | undefined>> = {
  letter: 'Letter',
  legal: 'Legal',
  tabloid: 'Tabloid',
  a4: 'A4',
  a3: 'A3',
}
