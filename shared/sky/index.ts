/**
 * Sky engine: Sun, Moon and fixed-target positions, refraction, night events, time zones,
 * galactic coordinates and the target catalogue. Pure TypeScript on astronomy-engine 2.1.19.
 */
export * from './constants';
export * from './guards';
export * from './refraction';
export * from './positions';
export * from './crossings';
export * from './timezone';
export * from './night';
export * from './galactic';
export * from './catalogue';
