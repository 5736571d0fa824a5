/**
 * Geometry the booklet needs that geometry/index.ts does not re-export yet (the core is being
 * finished alongside). Imported from their own modules here, in one place, so the day the index
 * exports them this file shrinks to re-exports from '@/geometry'.
 */
export { leafTemplate, placeLeaf, type LeafTemplate, type LeafPlacement } from '@/geometry/leaf-template'
