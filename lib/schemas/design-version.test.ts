/**
 * Design format version 2: a colourway gives every fabric role a fabric `{ name, color, swatch? }`
 * (the swatch an upload id) where version 1 gave it only a colour, and may name its theme photo
 * (`themePhoto`, an upload id). Version 1 files still open, upgraded on read; the fixture
 * files stay version 1 on disk and are read through the upgrade here.
 */
import { readdirSync, readFileSync } from 'node:fs'
import path from 'node:path'
import { describe, expect, it } from 'vitest'
import { DEMO_PATTERNS } from '@/scripts/demo-data'
import { designFileSchema, parseDesign, swatchFromLegacyKey, upgradeDesignFile, type DesignFile } from './design'

/** An upload id, as the upload route answers it (made up). */
const SWATCH = '0b6e4a1c-3f2d-4c8e-9a71-5d2e8f4b6c10'

const FIXTURES = path.join(__dirname, '..', '..', 'geometry', 'fixtures')

/** A version 2 design as version 1 wrote it: each fabric only its colour (the migration's down). */
function asVersion1(design: DesignFile): Record<string, unknown> {
  return {
    ...design,
    version: 1,
    colorways: design.colorways?.map((c) => ({ name: c.name, fabrics: Object.fromEntries(Object.entries(c.fabrics).map(([role, f]) => [role, f.color])) })),
  }
}

describe('design format version 2', () => {
  it('upgrades a version 1 colour to a fabric named by its role in words', () => {
    const v1 = { format: 'wreathwright-design', version: 1, name: 'Old', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [],
      colorways: [{ name: 'Holly', fabrics: { 'leaf-dark': '#2f5540', background_shade: '#e1e8ee', stem: '#4a3a2a' } }] }
    const parsed = parseDesign(v1)
    if (!parsed.ok) throw new Error(parsed.issues[0]?.message)
    expect(parsed.file.version).toBe(2)
    expect(parsed.file.colorways).toEqual([{
      name: 'Holly',
      fabrics: { 'leaf-dark': { name: 'Leaf dark', color: '#2f5540' }, background_shade: { name: 'Background shade', color: '#e1e8ee' }, stem: { name: 'Stem', color: '#4a3a2a' } },
    }])
    // The core gets the same version 2 colourways.
    expect(parsed.design.colorways[0]!.fabrics['leaf-dark']).toEqual({ name: 'Leaf dark', color: '#2f5540' })
  })

  it('refuses a wrong colour of a version 1 file at the path of the upgraded fabric', () => {
    const v1 = { format: 'wreathwright-design', version: 1, name: 'Old', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [],
      colorways: [{ name: 'Holly', fabrics: { stem: 'brown' } }] }
    const parsed = parseDesign(v1)
    expect(parsed.ok).toBe(false)
    if (!parsed.ok) expect(parsed.issues[0]).toEqual({ path: 'colorways.0.fabrics.stem.color', message: 'a colour is #rrggbb' })
    // A version 1 file cannot carry version 2 fabrics: the value is taken as its colour, and refused.
    const mixed = { ...v1, colorways: [{ name: 'Holly', fabrics: { stem: { name: 'Bark', color: '#4a3a2a' } } }] }
    expect(parseDesign(mixed).ok).toBe(false)
  })

  it('reads version 2 fabrics with a display name, a colour and an optional swatch upload id; refuses what is not', () => {
    const base = { format: 'wreathwright-design', version: 2, name: 'New', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [] }
    const fabric = (f: unknown) => ({ ...base, colorways: [{ name: 'Holly', fabrics: { stem: f } }] })
    const read = parseDesign(fabric({ name: '  Bark brown  ', color: '#4a3a2a', swatch: SWATCH.toUpperCase() }))
    expect(read.ok && read.file.colorways?.[0]?.fabrics.stem).toEqual({ name: 'Bark brown', color: '#4a3a2a', swatch: SWATCH })
    const firstPath = (json: unknown) => {
      const parsed = parseDesign(json)
      return parsed.ok ? null : parsed.issues[0]!.path
    }
    expect(firstPath(fabric('#4a3a2a'))).toBe('colorways.0.fabrics.stem')
    expect(firstPath(fabric({ name: '', color: '#4a3a2a' }))).toBe('colorways.0.fabrics.stem.name')
    expect(firstPath(fabric({ name: 'Bark\u0000', color: '#4a3a2a' }))).toBe('colorways.0.fabrics.stem.name')
    for (const swatch of ['not-an-upload', `${SWATCH}0`, SWATCH.replaceAll('-', ''), '../../etc/passwd', '/uploads/a.webp', 'a b.webp', 'a\u0000b', 'k'.repeat(201), 42]) {
      const parsed = parseDesign(fabric({ name: 'Bark', color: '#4a3a2a', swatch }))
      expect(parsed.ok ? null : parsed.issues[0], String(swatch)).toMatchObject({ path: 'colorways.0.fabrics.stem.swatch' })
    }
    expect(parseDesign(fabric({ name: 'Bark', color: '#4a3a2a', swatch: 'nope' }))).toMatchObject({ ok: false, issues: [{ message: 'an upload id is a UUID, as the upload answered it' }] })
    expect(firstPath(fabric({ name: 'Bark', color: '#4a3a2a', price: 5 }))).toBe('colorways.0.fabrics.stem')
    // Colourways are named by their names: twice is refused.
    const twice = { ...base, colorways: [{ name: 'Holly', fabrics: {} }, { name: 'Holly', fabrics: {} }] }
    expect(firstPath(twice)).toBe('colorways.1.name')
  })

  it('reads a swatch named by its object-store key (the first version 2 files) as the upload id the key holds', () => {
    const base = { format: 'wreathwright-design', version: 2, name: 'New', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [] }
    const withSwatches = (stem: string, berry: string) => ({ ...base, colorways: [{ name: 'Holly', fabrics: { stem: { name: 'Bark', color: '#4a3a2a', swatch: stem }, berry: { name: 'Cranberry', color: '#a3392b', swatch: berry } } }] })
    // The upload route stores an image as <prefix>uploads/<owner>/<kind>/<id>.<ext> (lib/services/uploads.ts).
    const parsed = parseDesign(withSwatches(`designs/uploads/9d1e/swatch/${SWATCH.toUpperCase()}.webp`, 'uploads/u1/holly.webp'))
    if (!parsed.ok) throw new Error(parsed.issues[0]?.message)
    expect(parsed.file.colorways?.[0]?.fabrics.stem).toEqual({ name: 'Bark', color: '#4a3a2a', swatch: SWATCH })
    // A key that holds no upload id names nothing any address serves: the fabric reads without a swatch.
    expect(parsed.file.colorways?.[0]?.fabrics.berry).toEqual({ name: 'Cranberry', color: '#a3392b' })
    expect(swatchFromLegacyKey(`uploads/u/swatch/${SWATCH}.png`)).toBe(SWATCH)
    expect(swatchFromLegacyKey(`uploads/u/swatch/${SWATCH}.gif`)).toBeUndefined()
    // An id, or what is no key at all, is left for the schema.
    for (const value of [SWATCH, 'not-an-upload', '../x/y.webp', 42]) expect(swatchFromLegacyKey(value)).toBe(value)
  })

  it("reads a colourway's theme photo as an upload id, optional, and refuses another value at its path", () => {
    const base = { format: 'wreathwright-design', version: 2, name: 'New', units: 'in', ring: { innerRadius: 0, outerRadius: 9, repeats: 4, repeatMode: 'rotate' }, seams: [] }
    const withPhoto = (themePhoto: unknown) => ({ ...base, colorways: [{ name: 'Holly', fabrics: {} }, { name: 'Frost', fabrics: {}, themePhoto }] })
    const parsed = parseDesign(withPhoto(SWATCH))
    expect(parsed.ok && parsed.file.colorways?.map((c) => c.themePhoto)).toEqual([undefined, SWATCH])
    for (const themePhoto of ['uploads/u1/frost.webp', 'frost', '', null, 7]) {
      const refused = parseDesign(withPhoto(themePhoto))
      expect(refused.ok ? null : refused.issues[0]!.path, String(themePhoto)).toBe('colorways.1.themePhoto')
    }
  })

  it('upgrades every geometry fixture file (version 1 on disk) to the same design in version 2', () => {
    const names = readdirSync(FIXTURES, { withFileTypes: true }).filter((entry) => entry.isDirectory()).map((entry) => entry.name)
    expect(names.length).toBeGreaterThan(10)
    for (const name of names) {
      const json = JSON.parse(readFileSync(path.join(FIXTURES, name, 'design.json'), 'utf8')) as Record<string, unknown>
      expect(json.version, name).toBe(1)
      const parsed = designFileSchema.safeParse(json)
      expect(parsed.success, name).toBe(true)
      if (!parsed.success) continue
      expect(parsed.data.version).toBe(2)
      // Nothing but the version and the colourways' fabrics changes.
      const { colorways: before, ...rest } = json
      const { colorways: after, ...upgradedRest } = parsed.data
      expect(upgradedRest, name).toEqual(designFileSchema.parse({ ...rest, version: 2 }))
      expect(after?.map((c) => c.name), name).toEqual((before as { name: string }[] | undefined)?.map((c) => c.name))
    }
  })

  it('upgrades every demo design stored as version 1 (before the migration) back to its colours, names from the roles', () => {
    expect(DEMO_PATTERNS.length).toBeGreaterThan(0)
    for (const { design } of DEMO_PATTERNS) {
      const upgraded = designFileSchema.parse(asVersion1(design))
      expect(upgraded.version).toBe(2)
      expect(upgraded.colorways?.map((c) => c.name)).toEqual(design.colorways?.map((c) => c.name))
      for (const [index, colorway] of (design.colorways ?? []).entries()) {
        for (const [role, fabric] of Object.entries(colorway.fabrics)) {
          expect(upgraded.colorways![index]!.fabrics[role]).toEqual({ name: role.charAt(0).toUpperCase() + role.slice(1).replaceAll('-', ' '), color: fabric.color })
        }
      }
      // Everything else reads the same as the version 2 design.
      expect({ ...upgraded, colorways: null }).toEqual({ ...designFileSchema.parse(design), colorways: null })
    }
  })

  it('each demo pattern comes in at least two colourways, every fabric named', () => {
    for (const { design } of DEMO_PATTERNS) {
      expect(design.colorways?.length, design.name).toBeGreaterThanOrEqual(2)
      for (const colorway of design.colorways ?? []) {
        for (const [role, fabric] of Object.entries(colorway.fabrics)) expect(fabric.name, `${design.name} / ${colorway.name} / ${role}`).not.toBe(role)
      }
    }
  })

  it('leaves a version 2 file and anything that is not a version 1 design as it is', () => {
    const v2 = { version: 2, colorways: [] }
    expect(upgradeDesignFile(v2)).toBe(v2)
    expect(upgradeDesignFile(null)).toBe(null)
    expect(upgradeDesignFile([1])).toEqual([1])
  })
})
