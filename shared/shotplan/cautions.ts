/**
 * The cautions a shot plan and its shot card carry: tides, cliffs, darkness and cold, and that a
 * computed plan is a plan, not a promise. Plain English, one sentence or two each.
 */
import { TIDE_CAUTION } from '../tide/caution';

/** Near cliff edges and on rock in the dark. */
export const CLIFF_CAUTION =
  'In the dark keep well back from cliff edges and unfenced drops, stay off wet rock and out of ' +
  'overhangs and caves, and walk in by daylight first.';
/** Being out at night. */
export const DARKNESS_CAUTION =
  'Carry a head torch with a red setting and a spare light, keep your phone charged, and tell ' +
  'someone where you are going and when you will be back.';
/** Cold and damp. */
export const COLD_CAUTION =
  'Clear nights are cold and often damp, and standing still by a tripod chills you fast: bring ' +
  'warm layers, a hat, gloves and something hot to drink.';
/** Always last. */
export const PLAN_NOT_PROMISE =
  'A plan, not a promise: the times are computed predictions. Weather, tides and the ground ' +
  'change; check the official tide table, local rules and local knowledge before you go.';

/** What the cautions depend on; see {@link shotPlanCautions}. */
export interface ShotPlanCautionInputs {
  /** Whether the sightline has a tide rule. */
  hasTideRule: boolean;
  /** The lineup's tide status under that rule, if any. */
  tideStatus?: 'reachable' | 'cut-off' | 'unknown' | null;
  /** When the tide cuts the spot off, as local clock text (e.g. '01:40 BST'), if it does. */
  tideCutOffText?: string | null;
  /** Deadline warnings of the timeline, as sentences. */
  warnings?: readonly string[];
  /** The magnetic model's warnings and whether a compass can be trusted at the vantage. */
  compassReliable?: boolean;
  declinationWarnings?: readonly string[];
  /** True when the plan is tracked but the gear has no star tracker. */
  trackedWithoutTracker?: boolean;
  /** True when the night has no astronomical darkness. */
  noAstronomicalDarkness?: boolean;
}

/**
 * The cautions of a shot plan, most specific first: the tide (status, cut-off and the general
 * tide caution when the sightline has a tide rule), the timeline's deadline warnings, compass and
 * gear notes, then cliffs, darkness and cold, and last that the plan is not a promise.
 * @param inputs - see {@link ShotPlanCautionInputs}
 * @returns the cautions, each a sentence or two; never empty
 * @throws RangeError when inputs is not an object
 */
export function shotPlanCautions(inputs: ShotPlanCautionInputs): string[] {
  if (typeof inputs !== 'object' || inputs === null) throw new RangeError('inputs must be an object');
  const out: string[] = [];
  if (inputs.hasTideRule) {
    if (inputs.tideStatus === 'cut-off') {
      out.push(`The tide cuts the spot off during this lineup${inputs.tideCutOffText ? ` from ${inputs.tideCutOffText}` : ''}: plan to be out before then, or choose another night.`);
    } else if (inputs.tideStatus === 'unknown') {
      out.push('The stored tide times do not cover this lineup: paste the official tide times for the night before relying on this plan.');
    } else if (inputs.tideCutOffText) {
      out.push(`The tide cuts the spot off from ${inputs.tideCutOffText}: leave before then.`);
    }
    out.push(TIDE_CAUTION);
  }
  for (const w of inputs.warnings ?? []) out.push(w);
  if (inputs.noAstronomicalDarkness) out.push('The Sun stays above -18 deg all night: the sky never gets fully dark.');
  if (inputs.compassReliable === false) out.push('A compass cannot be trusted at this vantage: take the bearing from landmarks or the map.');
  for (const w of inputs.declinationWarnings ?? []) out.push(w);
  if (inputs.trackedWithoutTracker) out.push('This plan tracks the sky, but your gear lists no star tracker.');
  out.push(CLIFF_CAUTION, DARKNESS_CAUTION, COLD_CAUTION, PLAN_NOT_PROMISE);
  return out;
}
