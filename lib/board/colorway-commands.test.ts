import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { designFileSchema, type DesignFile } from '@/lib/schemas/design'
import { boardActions } from './actions'
import { createBoardStore, design as designOf, type BoardStore } from './store'

/** Upload ids, as the upload route answers them (made up). */
const SWATCH = '0b6e4a1c-3f2d-4c8e-9a71-5d2e8f4b6c10'
const PHOTO = '7c1d9e35-8a42-4f06-b3e1-2a9c5d7f8e04'
const OTHER_PHOTO = 'e3a95b20-6c1f-4d7a-8e52-b0f4c9d3a617'

/** Two colourways of the same two roles, as the board keeps them. */
function twoColorways(): DesignFile {
  return {
    ...emptyDesign('Colourways'),
    colorways: [
      { name: 'Holly', fabrics: { background: { name: 'Cream tone-on-tone', color: '#f4ecd8' }, 'leaf-dark': { name: 'Holly green batik', color: '#2f5540' } } },
      { name: 'Frost', fabrics: { background: { name: 'Snowberry white', color: '#eef2f5' }, 'leaf-dark': { name: 'Spruce shadow', color: '#41607a' } } },
    ],
  }
}

const colorwaysOf = (store: BoardStore) => designOf(store.getState()).colorways
const namesOf = (store: BoardStore) => colorwaysOf(store).map((c) => c.name)
const context = (store: BoardStore) => ({ store, fit: () => {}, toggleHelp: () => {}, canvasCentre: () => [0, 0] as const })
const valid = (store: BoardStore) => designFileSchema.safeParse(designOf(store.getState())).success

describe('colourway commands on the board', () => {
  it('renames a fabric and recolours it in one colourway only, each one undoable step', () => {
    const store = createBoardStore(twoColorways())
    store.run('renameFabric', { colorway: 'Frost', fabric: 'background', name: '  Icicle white  ' })
    store.run('setFabricColour', { colorway: 'Frost', fabric: 'background', colour: '#DDE6EE' })
    expect(colorwaysOf(store)[1]!.fabrics.background).toEqual({ name: 'Icicle white', color: '#dde6ee' })
    expect(colorwaysOf(store)[0]!.fabrics.background).toEqual({ name: 'Cream tone-on-tone', color: '#f4ecd8' })
    expect(valid(store)).toBe(true)
    store.undo()
    expect(colorwaysOf(store)[1]!.fabrics.background).toEqual({ name: 'Icicle white', color: '#eef2f5' })
    store.undo()
    expect(colorwaysOf(store)).toEqual(twoColorways().colorways)
  })

  it('refuses what the file schema refuses: an empty name, a colour that is not #rrggbb, an unknown role; nothing is recorded', () => {
    const store = createBoardStore(twoColorways())
    const before = store.getState().history
    store.run('renameFabric', { colorway: 'Frost', fabric: 'background', name: '   ' })
    store.run('renameFabric', { colorway: 'Frost', fabric: 'background', name: 'Bad\u0000name' })
    store.run('setFabricColour', { colorway: 'Frost', fabric: 'background', colour: 'white' })
    store.run('setFabricColour', { colorway: 'Frost', fabric: 'berry', colour: '#a3392b' })
    store.run('renameColorway', { colorway: 'Frost', name: 'Holly' })
    store.run('addColorway', { name: 'Frost' })
    expect(store.getState().history.past).toEqual(before.past)
    expect(colorwaysOf(store)).toEqual(twoColorways().colorways)
  })

  it('sets and removes a swatch image by its upload id, each one undoable step; redo puts it back', () => {
    const store = createBoardStore(twoColorways())
    const swatch = () => colorwaysOf(store)[0]!.fabrics['leaf-dark']!.swatch
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: SWATCH.toUpperCase() })
    // Kept as the upload route answers ids: lower case.
    expect(swatch()).toBe(SWATCH)
    expect(colorwaysOf(store)[1]!.fabrics['leaf-dark']!.swatch).toBeUndefined()
    expect(valid(store)).toBe(true)
    const history = store.getState().history
    // Not an upload id (an object-store key, a path), or the swatch it already has: nothing recorded.
    for (const refused of ['uploads/u1/holly.webp', '../etc/passwd', `${SWATCH}x`, SWATCH]) store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: refused })
    expect(store.getState().history).toBe(history)
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: null })
    expect('swatch' in colorwaysOf(store)[0]!.fabrics['leaf-dark']!).toBe(false)
    store.undo()
    expect(swatch()).toBe(SWATCH)
    store.undo()
    expect(colorwaysOf(store)).toEqual(twoColorways().colorways)
    store.redo()
    expect(swatch()).toBe(SWATCH)
  })

  it('sets the theme photo of one colourway, removes it, and undo and redo step through each', () => {
    const store = createBoardStore(twoColorways(), { activeColorway: 'Frost' })
    const photos = () => colorwaysOf(store).map((c) => c.themePhoto)
    store.run('setThemePhoto', { colorway: 'Frost', upload: PHOTO })
    expect(photos()).toEqual([undefined, PHOTO])
    expect(valid(store)).toBe(true)
    store.run('setThemePhoto', { colorway: 'Frost', upload: OTHER_PHOTO })
    expect(photos()).toEqual([undefined, OTHER_PHOTO])
    const history = store.getState().history
    for (const refused of ['not-an-id', 'uploads/u1/frost.webp', OTHER_PHOTO]) store.run('setThemePhoto', { colorway: 'Frost', upload: refused })
    store.run('setThemePhoto', { colorway: 'Holly', upload: null })
    store.run('setThemePhoto', { colorway: 'Winter', upload: PHOTO })
    expect(store.getState().history).toBe(history)
    store.run('setThemePhoto', { colorway: 'Frost', upload: null })
    expect(photos()).toEqual([undefined, undefined])
    expect('themePhoto' in colorwaysOf(store)[1]!).toBe(false)
    store.undo()
    expect(photos()).toEqual([undefined, OTHER_PHOTO])
    store.undo()
    expect(photos()).toEqual([undefined, PHOTO])
    store.undo()
    expect(colorwaysOf(store)).toEqual(twoColorways().colorways)
    store.redo()
    store.redo()
    expect(photos()).toEqual([undefined, OTHER_PHOTO])
  })

  it('keeps the theme photo and the swatches on a duplicate, not on a new colourway', () => {
    const store = createBoardStore(twoColorways())
    store.run('setThemePhoto', { colorway: 'Holly', upload: PHOTO })
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'background', swatch: SWATCH })
    boardActions.duplicateColorway.run(context(store))
    expect(colorwaysOf(store)[1]).toMatchObject({ name: 'Holly copy', themePhoto: PHOTO, fabrics: { background: { swatch: SWATCH } } })
    // The copy's photo is its own to change.
    store.run('setThemePhoto', { colorway: 'Holly copy', upload: OTHER_PHOTO })
    expect(colorwaysOf(store)[0]!.themePhoto).toBe(PHOTO)
    store.chooseColorway('Holly')
    boardActions.newColorway.run(context(store))
    expect(colorwaysOf(store)[3]!.name).toBe('Colourway 4')
    expect(colorwaysOf(store)[3]!.themePhoto).toBeUndefined()
    expect(colorwaysOf(store)[3]!.fabrics.background!.swatch).toBe(SWATCH)
    expect(valid(store)).toBe(true)
  })

  it('adds a fabric role to every colourway, named in words, in one undoable step', () => {
    const store = createBoardStore(twoColorways())
    store.run('addFabric', { fabric: 'leaf-medium', colour: '#c8b89a' })
    for (const colorway of colorwaysOf(store)) expect(colorway.fabrics['leaf-medium']).toEqual({ name: 'Leaf medium', color: '#c8b89a' })
    store.run('addFabric', { fabric: 'berry', colour: '#a3392b', name: 'Cranberry dot' })
    expect(colorwaysOf(store)[1]!.fabrics.berry!.name).toBe('Cranberry dot')
    // A role already there keeps its fabrics.
    store.run('addFabric', { fabric: 'background', colour: '#000000' })
    expect(colorwaysOf(store)[0]!.fabrics.background!.color).toBe('#f4ecd8')
    store.undo()
    store.undo()
    expect(colorwaysOf(store)).toEqual(twoColorways().colorways)
  })

  it('duplicates a colourway right after it, as a copy of its own to change, and shows the copy', () => {
    const store = createBoardStore(twoColorways())
    boardActions.duplicateColorway.run(context(store))
    expect(namesOf(store)).toEqual(['Holly', 'Holly copy', 'Frost'])
    expect(store.getState().activeColorway).toBe('Holly copy')
    store.run('renameFabric', { colorway: 'Holly copy', fabric: 'background', name: 'Oatmeal linen-look' })
    expect(colorwaysOf(store)[0]!.fabrics.background!.name).toBe('Cream tone-on-tone')
    store.run('duplicateColorway', { colorway: 'Holly' })
    expect(namesOf(store)).toEqual(['Holly', 'Holly copy 2', 'Holly copy', 'Frost'])
    expect(valid(store)).toBe(true)
    store.undo()
    store.undo()
    store.undo()
    expect(namesOf(store)).toEqual(['Holly', 'Frost'])
    // The copy it showed is undone away: the board shows the colourway now at its place.
    expect(store.getState().activeColorway).toBe('Frost')
  })

  it('creates a new colourway as a copy of the one shown, named so no other has its name', () => {
    const store = createBoardStore(twoColorways(), { activeColorway: 'Frost' })
    boardActions.newColorway.run(context(store))
    expect(namesOf(store)).toEqual(['Holly', 'Frost', 'Colourway 3'])
    expect(colorwaysOf(store)[2]!.fabrics).toEqual(colorwaysOf(store)[1]!.fabrics)
    expect(store.getState().activeColorway).toBe('Colourway 3')
  })

  it('renames a colourway, and the board keeps showing it; undo gives the old name back', () => {
    const store = createBoardStore(twoColorways(), { activeColorway: 'Frost' })
    store.run('renameColorway', { colorway: 'Frost', name: 'Winter frost' })
    expect(namesOf(store)).toEqual(['Holly', 'Winter frost'])
    expect(store.getState().activeColorway).toBe('Winter frost')
    store.undo()
    expect(namesOf(store)).toEqual(['Holly', 'Frost'])
    expect(store.getState().activeColorway).toBe('Frost')
  })

  it('moves a colourway earlier or later, never past the ends', () => {
    const store = createBoardStore(twoColorways())
    store.run('moveColorway', { colorway: 'Frost', by: -1 })
    expect(namesOf(store)).toEqual(['Frost', 'Holly'])
    const history = store.getState().history
    store.run('moveColorway', { colorway: 'Frost', by: -1 })
    expect(store.getState().history).toBe(history)
    store.undo()
    expect(namesOf(store)).toEqual(['Holly', 'Frost'])
  })

  it('deletes a colourway, moving the board to a neighbour when it was shown; the last one stays', () => {
    const store = createBoardStore(twoColorways(), { activeColorway: 'Holly' })
    boardActions.deleteColorway.run(context(store))
    expect(namesOf(store)).toEqual(['Frost'])
    expect(store.getState().activeColorway).toBe('Frost')
    const history = store.getState().history
    boardActions.deleteColorway.run(context(store))
    store.run('deleteColorway', { colorway: 'Frost' })
    expect(namesOf(store)).toEqual(['Frost'])
    expect(store.getState().history).toBe(history)
    store.undo()
    expect(namesOf(store)).toEqual(['Holly', 'Frost'])
    // Deleting the last one in the list shows the one before it.
    store.chooseColorway('Frost')
    store.run('deleteColorway', { colorway: 'Frost' })
    expect(store.getState().activeColorway).toBe('Holly')
  })
})
