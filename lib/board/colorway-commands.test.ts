import { describe, expect, it } from 'vitest'
import { emptyDesign } from '@/lib/new-design'
import { designFileSchema, type DesignFile } from '@/lib/schemas/design'
import { boardActions } from './actions'
import { createBoardStore, design as designOf, type BoardStore } from './store'

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

  it('sets and removes a swatch image by its upload key', () => {
    const store = createBoardStore(twoColorways())
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: 'uploads/u1/holly.webp' })
    expect(colorwaysOf(store)[0]!.fabrics['leaf-dark']!.swatch).toBe('uploads/u1/holly.webp')
    expect(valid(store)).toBe(true)
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: '../etc/passwd' })
    expect(colorwaysOf(store)[0]!.fabrics['leaf-dark']!.swatch).toBe('uploads/u1/holly.webp')
    store.run('setFabricSwatch', { colorway: 'Holly', fabric: 'leaf-dark', swatch: null })
    expect('swatch' in colorwaysOf(store)[0]!.fabrics['leaf-dark']!).toBe(false)
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
