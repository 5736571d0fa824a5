import { percentOf, type Progress } from '@/lib/sewing-room-client/merge'

/** A progress bar with its figures for screen readers; `size` "large" for the page's overall bar. */
export function ProgressBar({ progress, label, size = 'small' }: { progress: Progress; label: string; size?: 'small' | 'large' }) {
  const percent = percentOf(progress)
  return (
    <div
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={progress.total}
      aria-valuenow={progress.done}
      aria-valuetext={`${progress.done} of ${progress.total} steps done`}
      className={`w-full overflow-hidden rounded-full bg-linen-200 ${size === 'large' ? 'h-3' : 'h-1.5'}`}
    >
      {/* The bar is an SVG so its width is an attribute, not a style. */}
      <svg viewBox="0 0 100 1" preserveAspectRatio="none" className="block h-full w-full" aria-hidden="true">
        <rect x={0} y={0} width={percent} height={1} fill={percent === 100 ? '#23402f' : '#3f6b4f'} className="transition-[width] duration-500" />
      </svg>
    </div>
  )
}
