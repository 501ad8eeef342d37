/**
 * The lineup engine: dark windows, frame passages and the lineup search (pure TypeScript on
 * astronomy-engine). See searchLineups.ts for the method and score.ts for the score.
 */
export { searchLineups, MAX_TARGETS, DARK_WINDOW_SITE_TOLERANCE_DEG, type Lineup, type SearchOptions } from './searchLineups';
export { computeDarkWindows, type DarkWindow, type DarkWindowSet } from './darkWindows';
export { computeFramePassages, type TimeInterval } from './passages';
export { lineupScore, centringFromOffsets, type ScoreInputs } from './score';
export { type LineupConditions, type MoonCondition, DEFAULT_SUN_MAX_ALT_DEG, DEFAULT_MIN_DURATION_MIN } from './conditions';
export { MAX_RANGE_DAYS } from './time';
