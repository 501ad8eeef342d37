import type { Lineup, LineupSearchResponse } from '../../shared/schemas/lineup';
import type { SightlineModel } from '../models/sightline';
import type { UserModel } from '../models/user';
import { targetRefName, type WatchModel } from '../models/watch';
import type { LineupService } from './lineup-service';
import { lineupMatchesWatch } from './watch-timing';

const DAY_MS = 86_400_000;
/** Length of the fixed search blocks, days (anchored at 1970-01-01 00:00 UTC). */
export const SEARCH_BLOCK_DAYS = 7;

/** A watch's lineups over a range, with what an e-mail or a calendar event shows beside them. */
export interface WatchedLineups {
  timezone: string;
  targetName: string;
  target: LineupSearchResponse['target'];
  lineups: Lineup[];
}

/**
 * Finds the lineups a watch asks for, through the lineup search on its saved sightline (so they
 * carry the sightline's tide status): a dark sky (Sun below -18 deg, Moon down), then the watch's
 * score, duration, tide and night-of-the-week conditions.
 *
 * The search runs over fixed blocks of {@link SEARCH_BLOCK_DAYS} days, each widened by a day on
 * both sides, and keeps from a block the lineups that start inside it. The engine's times depend
 * slightly (milliseconds) on the range searched; with fixed blocks a lineup is always found by the
 * same search, so its start is the same in every scan and can key its e-mail.
 */
export class WatchLineups {
  constructor(private readonly lineups: LineupService) {}

  async find(watch: WatchModel & { sightline?: SightlineModel }, owner: UserModel, range: { from: Date; to: Date }): Promise<WatchedLineups> {
    const blockMs = SEARCH_BLOCK_DAYS * DAY_MS;
    const found: Lineup[] = [];
    let meta: Pick<LineupSearchResponse, 'timezone' | 'target'> | undefined;
    for (let start = Math.floor(range.from.getTime() / blockMs) * blockMs; start < range.to.getTime(); start += blockMs) {
      const result = await this.lineups.search(owner, {
        sightlineId: watch.sightlineId,
        target: watch.target,
        from: new Date(start - DAY_MS),
        to: new Date(start + blockMs + DAY_MS),
        conditions: { sunMaxAltDeg: -18, moon: 'down', minDurationMin: watch.minDurationMin },
      });
      meta ??= result;
      for (const l of result.lineups) {
        const t = Date.parse(l.start);
        if (t >= start && t < start + blockMs && t >= range.from.getTime() && t < range.to.getTime()) found.push(l);
      }
    }
    const timezone = meta?.timezone ?? watch.sightline?.timezone ?? 'UTC';
    return {
      timezone,
      targetName: meta?.target.name || targetRefName(watch.target),
      target: meta?.target ?? { name: targetRefName(watch.target), raHours: 0, decDeg: 0 },
      lineups: found.filter((l) => lineupMatchesWatch(l, watch, timezone)),
    };
  }
}
