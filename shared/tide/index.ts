/**
 * Tide features of a sightline: tide rule and tide event schemas, parsing pasted tide times,
 * reachable intervals and the tide status of a lineup, and the caution shown beside them.
 */
export {
  MAX_TIDE_HEIGHT_M,
  MAX_TIDE_RULE_HOURS,
  MAX_TIDE_RULE_NOTE_CHARS,
  MIN_TIDE_HEIGHT_M,
  tideEventSchema,
  tideKindSchema,
  tideRuleSchema,
  type TideEvent,
  type TideKind,
  type TideRule,
} from './schemas';
export {
  isCleanTideParse,
  MAX_TIDE_TEXT_CHARS,
  MAX_TIDE_TEXT_LINES,
  parseTideTimes,
  type TideLineIssue,
  type TideParseResult,
} from './parse';
export {
  MAX_TIDE_EVENT_GAP_MIN,
  MIN_TIDE_EVENT_SPACING_MIN,
  SEMIDIURNAL_HALF_PERIOD_MIN,
} from './sequence';
export {
  resolveLocalTime,
  type LocalTimeResolution,
  type LocalWallTime,
} from './localTime';
export { isValidTimeZone } from '../sky/timezone';
export {
  lineupTideStatus,
  lineupTideStatusFromAccess,
  MAX_TIDE_EVENTS,
  reachableIntervals,
  TIDE_STATUSES,
  tideAccess,
  type LineupTideStatus,
  type TideAccess,
  type TideInterval,
  type TideStatus,
} from './status';
export { TIDE_CAUTION } from './caution';
