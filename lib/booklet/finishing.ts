/**
 * The finishing arithmetic the booklet prints (the binding of the ring's curved edges, where the
 * folded bias stem ring is sewn) is the core's one rule, geometry/bias.ts; the booklet reads it
 * from here.
 */
export { BINDING_JOIN_INCHES, bindingPlan, stemSewing, stemStrip } from '@/geometry/bias'
