/**
 * The geometry modules' guards and angle folding now live in shared/guards.ts and
 * shared/units.ts (one home for every shared module). The angle functions are re-exported here
 * because other folders (shared/chart) import them from this path.
 */
export { angleDifferenceDeg, normalizeDegrees360 } from '../units';
