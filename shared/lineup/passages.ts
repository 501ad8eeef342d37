/**
 * Public form of the frame passages: when a target is inside a frame, dark or not.
 */
import type { EquatorialJ2000, Frame, ObserverSite } from '../schemas/geometry';
import { placeNodes, targetNodeDirections } from './apparentPlace';
import { checkFrame, frameGeometry, framePassageIntervals, TargetTrack } from './framePassage';
import { checkSite } from './siteSky';
import { assertEquatorialJ2000 } from '../sky/guards';
import { RAD_PER_DEG } from '../units';
import { checkedRange, unixMsToUtDays, utDaysToUnixMs } from './time';

/** A UTC interval. */
export interface TimeInterval {
  start: Date;
  end: Date;
}

/**
 * Intervals when a fixed J2000 target's apparent position is inside the frame (definitions in
 * framePassage.ts), with no darkness condition.
 * @param frame - Azimuth 0..360 deg, half-width (0, 180] deg, apparent band bottom < top in -90..90 deg.
 * @param site - Latitude -90..90 deg, longitude -180..180 deg, elevation m.
 * @param target - RA 0..24 h, Dec -90..90 deg (J2000).
 * @param fromUtc - Range start; @param toUtc - Range end (after the start, at most ten years).
 * @returns Sorted intervals clipped to the range.
 * @throws RangeError on invalid input.
 */
export function computeFramePassages(frame: Frame, site: ObserverSite, target: EquatorialJ2000, fromUtc: Date, toUtc: Date): TimeInterval[] {
  checkFrame(frame);
  checkSite(site);
  assertEquatorialJ2000(target, 'target');
  const { fromMs, toMs } = checkedRange(fromUtc, toUtc);
  const from = unixMsToUtDays(fromMs);
  const to = unixMsToUtDays(toMs);
  const nodes = placeNodes(from, to);
  const track = new TargetTrack(nodes, targetNodeDirections(nodes, target), site.lon * RAD_PER_DEG);
  const flat = framePassageIntervals(frameGeometry(frame, site.lat, site.lon), track, from, to);
  const out: TimeInterval[] = [];
  for (let i = 0; i < flat.length; i += 2) out.push({ start: new Date(Math.round(utDaysToUnixMs(flat[i]!))), end: new Date(Math.round(utDaysToUnixMs(flat[i + 1]!))) });
  return out;
}
