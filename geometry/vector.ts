/**
 * Plane vector arithmetic shared by the allowance code: points and directions as [x, y] pairs.
 * `cross` is the z of the 3-D cross product: positive when b turns counter-clockwise from a
 * (our frame is y-up). For orientation tests of three points use orientation.ts instead.
 */
import type { Point } from './types'

/** A direction or a displacement: the same pair as a point (the one point type), read as an arrow. */
export type Vector = Point

/** @example add([1, 2], [3, 4]) // [4, 6] */
export const add = (a: Vector, b: Vector): Point => [a[0] + b[0], a[1] + b[1]]
/** @example subtract([3, 4], [1, 2]) // [2, 2] */
export const subtract = (a: Vector, b: Vector): Point => [a[0] - b[0], a[1] - b[1]]
/** @example scale([1, 2], 3) // [3, 6] */
export const scale = (a: Vector, factor: number): Point => [a[0] * factor, a[1] * factor]
/** @example dot([1, 0], [0, 1]) // 0 */
export const dot = (a: Vector, b: Vector): number => a[0] * b[0] + a[1] * b[1]
/** @example cross([1, 0], [0, 1]) // 1 */
export const cross = (a: Vector, b: Vector): number => a[0] * b[1] - a[1] * b[0]
