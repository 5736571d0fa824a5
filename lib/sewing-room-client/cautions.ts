/**
 * The usual cautions of the trade, in the sewing room where each one matters: the rotary cutter
 * by the cutting, the iron by the pressing, small parts by the finishing. They are short reminders
 * (the booklet carries them in full, lib/booklet/cautions.ts) and leave the judgement to the maker.
 */

export interface Caution {
  readonly id: 'rotary-cutter' | 'hot-iron' | 'small-parts'
  readonly title: string
  readonly text: string
}

const ROTARY_CUTTER: Caution = {
  id: 'rotary-cutter',
  title: 'Rotary cutter',
  text: 'Close the blade each time you put the cutter down, cut away from yourself and keep your fingers behind the ruler.',
}
const HOT_IRON: Caution = {
  id: 'hot-iron',
  title: 'Hot iron',
  text: 'Keep the cord out of the way and switch the iron off when you step away from it.',
}
const SMALL_PARTS: Caution = {
  id: 'small-parts',
  title: 'Small parts',
  text: 'Folded leaves and stuffed berries can come loose: a quilt carrying them is not meant for infants or young children. You know who the quilt is for; leave them off or stitch them down where you judge it wise.',
}

/** What the cautions are: reminders, not a safety standard. */
export const CAUTIONS_NOTE = 'Reminders, not rules: your own judgement and your tools’ instructions come first.'

/**
 * The cautions that belong beside a checklist group (`cut`, `prepare-leaves`, `repeat-3`,
 * `join-sections`, `join-repeats`, `finishing`).
 *
 * @example cautionsFor('cut').map((caution) => caution.id) // ['rotary-cutter']
 */
export function cautionsFor(groupId: string): Caution[] {
  if (groupId === 'cut') return [ROTARY_CUTTER]
  // Leaves are folded and pressed; every flip-and-sew seam and every join is pressed before the next.
  if (groupId === 'prepare-leaves' || groupId.startsWith('repeat-') || groupId.startsWith('join-')) return [HOT_IRON]
  if (groupId === 'finishing') return [HOT_IRON, SMALL_PARTS]
  return []
}
