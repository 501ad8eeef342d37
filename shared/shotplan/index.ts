/**
 * Shot plan maths: derived gear figures, framing (field of view, fit in one frame, the longest
 * focal length that fits), panorama grids, exposure limits (500 rule, NPF rule, tracked stacks),
 * the night's timeline with deadline warnings, the cautions, the whole plan of a lineup, and the
 * layouts its drawings share (frame outlines, azimuth unwrapping, the timeline bar). Pure; the
 * gear and shot plan schemas are in shared/schemas/gear.ts and shared/schemas/shot-plan.ts.
 */
export * from './gear';
export * from './framing';
export * from './panorama';
export * from './exposure';
export * from './timeline';
export * from './cautions';
export * from './outline';
export * from './sketch';
export * from './plan';
