/**
 * What the pattern shelf shows of a design, kept in columns beside it (migration
 * 20261202-0020) so that the list never reads the designs themselves: a design may be megabytes.
 */
import { CENTIMETRES_PER_INCH } from '@/lib/units'

export interface DesignSummary {
  /** Repeats around the ring. */
  readonly repeats: number
  /** The ring's finished outer diameter, inches. */
  readonly outerDiameterInches: number
  /** Seams in repeat 0. */
  readonly seamCount: number
}

/**
 * The summary of a stored design file. Reads the JSON defensively (a design the schema no longer
 * accepts still gets a summary: zeros where a field is unreadable), the same way the migration
 * backfills existing rows in SQL.
 *
 * @example designSummary({ units: 'in', ring: { repeats: 8, outerRadius: 9 }, seams: [] }) // { repeats: 8, outerDiameterInches: 18, seamCount: 0 }
 */
export function designSummary(design: unknown): DesignSummary {
  const file = (design ?? {}) as { units?: unknown; ring?: { repeats?: unknown; outerRadius?: unknown }; seams?: unknown }
  const number = (value: unknown): number => (typeof value === 'number' && Number.isFinite(value) ? value : 0)
  const radius = number(file.ring?.outerRadius)
  return {
    repeats: number(file.ring?.repeats),
    outerDiameterInches: 2 * (file.units === 'cm' ? radius / CENTIMETRES_PER_INCH : radius),
    seamCount: Array.isArray(file.seams) ? file.seams.length : 0,
  }
}
