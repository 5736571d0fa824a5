'use client'

import dynamic from 'next/dynamic'
import type { DesignFile } from '@/lib/schemas/design'

// Konva needs a real canvas, so the board renders in the browser only.
const DraftingBoard = dynamic(() => import('./drafting-board').then((module) => module.DraftingBoard), {
  ssr: false,
  loading: () => <p className="p-8 text-stone-500">Opening the drafting board…</p>,
})

export function DraftingBoardLoader(props: { patternId: string; patternName: string; revision: number; design: DesignFile }) {
  return <DraftingBoard {...props} />
}
