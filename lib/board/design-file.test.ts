import { describe, expect, it } from 'vitest'
import type { DesignFile } from '@/lib/schemas/design'
import { DESIGN_FILE_MAX_BYTES, designFileName, exportDesignFile, importDesignFile } from './design-file'

/** Upload ids, as the upload route answers them (made up). */
const SWATCH = '0b6e4a1c-3f2d-4c8e-9a71-5d2e8f4b6c10'
const THEME_PHOTO = '7c1d9e35-8a42-4f06-b3e1-2a9c5d7f8e04'

function design(overrides: Partial<DesignFile> = {}): DesignFile {
  return {
    format: 'wreathwright-design',
    version: 2,
    name: 'Winter Star',
    units: 'in',
    ring: { innerRadius: 0, outerRadius: 9, repeats: 6, repeatMode: 'mirror' },
    seams: [{ id: 's1', from: [1, 0], to: [0, 6] }],
    fills: [{ at: [0.5, 0.5], fabric: 'background' }],
    leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['leaf-dark', 'leaf-light'] }],
    stems: [],
    berries: [],
    curls: [],
    colorways: [
      {
        name: 'Winter',
        fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8', swatch: SWATCH }, 'leaf-dark': { name: 'Spruce batik', color: '#23402f' } },
        themePhoto: THEME_PHOTO,
      },
      { name: 'Ember', fabrics: { background: { name: 'Cinnamon stick tonal', color: '#8a4b2f' }, 'leaf-dark': { name: 'Moss shot cotton', color: '#5b7553' } } },
    ],
    order: null,
    ...overrides,
  }
}

describe('exporting the design file', () => {
  it('names the file after the design', () => {
    expect(designFileName('Winter Star')).toBe('winter-star.wreathwright.json')
    expect(designFileName('  Winter Star (sketch) ')).toBe('winter-star-sketch.wreathwright.json')
    expect(designFileName('Églantine & Rosé')).toBe('eglantine-rose.wreathwright.json')
    expect(designFileName('★★★')).toBe('design.wreathwright.json')
  })

  it('writes pretty JSON in the documented key order, whatever order the board keeps', () => {
    const { ring, format, ...rest } = design()
    const shuffled = { ...rest, ring, format } as DesignFile
    const file = exportDesignFile(shuffled)
    expect(file.fileName).toBe('winter-star.wreathwright.json')
    expect(file.mimeType).toBe('application/json')
    expect(file.text.endsWith('}\n')).toBe(true)
    expect(file.text).toContain('\n  "format": "wreathwright-design",\n  "version": 2,')
    expect(Object.keys(JSON.parse(file.text) as object)).toEqual([
      'format', 'version', 'name', 'units', 'ring', 'seams', 'fills', 'leaves', 'stems', 'berries', 'curls', 'colorways', 'order',
    ])
  })

  it('reads back exactly what it wrote: version 2, every colourway with its fabrics named', () => {
    const original = design()
    expect(importDesignFile(exportDesignFile(original).text)).toEqual({ ok: true, design: original })
  })

  it("keeps each colourway's theme photo and each fabric's swatch, as upload ids", () => {
    const written = JSON.parse(exportDesignFile(design()).text) as DesignFile
    expect(written.colorways?.[0]).toMatchObject({ themePhoto: THEME_PHOTO, fabrics: { background: { swatch: SWATCH } } })
    // The second colourway has neither, and the file says nothing of them.
    expect(Object.keys(written.colorways![1]!)).toEqual(['name', 'fabrics'])
  })

  it('opens a version 1 file, upgraded; exporting it writes version 2 with names from the roles', () => {
    const v1 = { ...design(), version: 1, colorways: [{ name: 'Winter', fabrics: { background: '#f4ecd8', 'leaf-dark': '#23402f' } }] }
    const imported = importDesignFile(JSON.stringify(v1))
    if (!imported.ok) throw new Error(imported.message)
    expect(imported.design.version).toBe(2)
    expect(imported.design.colorways).toEqual([
      { name: 'Winter', fabrics: { background: { name: 'Background', color: '#f4ecd8' }, 'leaf-dark': { name: 'Leaf dark', color: '#23402f' } } },
    ])
    const written = JSON.parse(exportDesignFile(imported.design).text) as DesignFile
    expect(written.version).toBe(2)
    expect(importDesignFile(exportDesignFile(imported.design).text)).toEqual({ ok: true, design: imported.design })
  })

  it('writes layer offsets only for a leaf that has them, and reads them back', () => {
    // Layers on the default fan are written as before offsets existed: plain fabric roles.
    expect(exportDesignFile(design()).text).not.toContain('layerOffsets')
    const offsets = design({ leaves: [{ id: 'l1', seam: 's1', at: 0.5, side: 'left', angle: 0, length: 1.5, width: 0.75, layers: ['leaf-dark', 'leaf-light'], layerOffsets: [{}, { turn: 12, scale: 0.8 }] }] })
    expect(importDesignFile(exportDesignFile(offsets).text)).toEqual({ ok: true, design: offsets })
  })
})

describe('importing a design file', () => {
  it('accepts the example of geometry.md with the optional lists left out', () => {
    const { fills: _f, leaves: _l, stems: _s, berries: _b, curls: _c, colorways: _w, order: _o, ...bare } = design()
    const result = importDesignFile(JSON.stringify(bare))
    expect(result.ok).toBe(true)
  })

  it('names each invalid field by its path and replaces nothing', () => {
    const broken = design({ ring: { innerRadius: 0, outerRadius: 9, repeats: 5, repeatMode: 'mirror' } })
    ;(broken.seams[0] as { to: unknown }).to = [0, 'six']
    const result = importDesignFile(JSON.stringify(broken))
    expect(result.ok).toBe(false)
    if (result.ok) return
    expect(result.message).toBe('This design file has 2 problems; the board was left as it was.')
    expect(result.issues.map((issue) => issue.path)).toEqual(['ring.repeatMode', 'seams.0.to.1'])
    expect(result.issues[0]!.message).toBe('mirrored repeats need an even number of repeats')
  })

  it('says one problem in the singular, and names unknown keys', () => {
    const result = importDesignFile(JSON.stringify({ ...design(), colour: 'red' }))
    expect(result).toMatchObject({ ok: false, message: 'This design file has one problem; the board was left as it was.' })
    expect(result.ok ? [] : result.issues[0]!.message).toContain('colour')
  })

  it('explains malformed JSON clearly', () => {
    const result = importDesignFile('{ "format": "wreathwright-design", ')
    expect(result).toMatchObject({ ok: false, message: 'This file is not readable JSON, so it cannot be a design file.' })
    expect(result.ok ? [] : result.issues.map((issue) => issue.path)).toEqual(['(file)'])
  })

  it('tells an empty file and a file of another kind apart from a broken design', () => {
    expect(importDesignFile('  \n')).toEqual({ ok: false, message: 'This file is empty.', issues: [] })
    expect(importDesignFile('[1, 2]')).toMatchObject({ ok: false, message: expect.stringContaining('not a Wreathwright design file') })
    expect(importDesignFile('{"type": "FeatureCollection"}')).toMatchObject({ ok: false, message: expect.stringContaining('not a Wreathwright design file') })
  })

  it('reads a file saved with a byte-order mark', () => {
    expect(importDesignFile(`\uFEFF${JSON.stringify(design())}`).ok).toBe(true)
  })

  it('refuses a file far larger than any design', () => {
    const result = importDesignFile(' '.repeat(DESIGN_FILE_MAX_BYTES + 1))
    expect(result).toMatchObject({ ok: false, message: 'This file is too large to be a Wreathwright design file.' })
  })
})
