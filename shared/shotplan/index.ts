/**
 * Shot plan maths: derived gear figures, framing (field of view, fit in one frame, the longest
 * focal length that fits), panorama grids, exposure limits (500 rule, NPF rule, tracked stacks)
 * and the night's timeline with deadline warnings. Pure; the gear schemas are in
 * shared/schemas/gear.ts.
 */
export * from './gear';
export * from './framing';
export * from './panorama';
export * from './exposure';
export * from './timeline';
