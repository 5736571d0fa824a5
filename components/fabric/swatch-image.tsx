'use client'

import { useState } from 'react'

/**
 * A fabric's swatch image as a small square, served by the upload route to those allowed to read
 * it (`/api/uploads/<id>`). An image that cannot be read (deleted, or not the reader's) shows
 * nothing: the colour chip beside it still stands for the fabric.
 *
 * @example <SwatchImage upload={colorway.fabrics.background.swatch} name="Cream tone-on-tone" />
 */
export function SwatchImage({ upload, name, className = 'h-8 w-8' }: { upload: string; name: string; className?: string }) {
  const [broken, setBroken] = useState<string | null>(null)
  if (broken === upload) return null
  return (
    // eslint-disable-next-line @next/next/no-img-element -- a private upload served by the API to its owner, not a file to optimise
    <img
      src={`/api/uploads/${upload}`}
      alt={`${name}: swatch image`}
      onError={() => setBroken(upload)}
      className={`${className} inline-block shrink-0 rounded border border-stone-400 object-cover align-middle`}
    />
  )
}
