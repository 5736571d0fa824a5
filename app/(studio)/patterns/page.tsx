import type { Metadata } from 'next'
import { PatternShelf } from '@/components/patterns/pattern-shelf'

export const metadata: Metadata = { title: 'Pattern shelf' }

export default function PatternShelfPage() {
  return (
    <div className="mx-auto max-w-6xl space-y-6">
      <h1 className="text-2xl font-semibold text-thread-800">Pattern shelf</h1>
      <PatternShelf />
    </div>
  )
}
