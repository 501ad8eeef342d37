import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import type { CalendarFeed } from '../../shared/schemas/watch';
import { AppError } from '../errors';
import { CalendarFeedModel } from '../models/calendar-feed';
import { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import { WatchModel } from '../models/watch';
import { watchedLineupsToIcs, type WatchedLineupEvent } from '../mail/watch-ics';
import type { Clock } from '../jobs/watch-scheduler';
import type { WatchLineups } from './watch-lineups';
import { nightOf } from './watch-timing';

/** How far ahead the feed lists lineups, days. */
export const FEED_HORIZON_DAYS = 60;
const DAY_MS = 86_400_000;
export const FEED_SECRET_RE = /^[A-Za-z0-9_-]{32,64}$/;

function newSecret(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * Each user's secret calendar feed: an iCalendar address a calendar app subscribes to, listing the
 * coming lineups of the user's active watches. The secret is the only key; rotating it makes the
 * old address stop working.
 */
export class CalendarFeedService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly finder: WatchLineups,
    private readonly appUrl: string,
    private readonly clock: Clock,
  ) {}

  private toPublic(feed: CalendarFeedModel): CalendarFeed {
    return { url: `${this.appUrl}/api/calendar/${feed.secret}.ics`, createdAt: feed.createdAt.toISOString() };
  }

  /** The user's feed address, made on first ask. */
  async feed(user: UserModel): Promise<CalendarFeed> {
    const [feed] = await CalendarFeedModel.findOrCreate({ where: { userId: user.id }, defaults: { userId: user.id, secret: newSecret() } });
    return this.toPublic(feed);
  }

  /** A new secret: the old address answers 404 from now on. */
  async rotate(user: UserModel): Promise<CalendarFeed> {
    // One upsert: two rotations at once (a double click) both succeed, the last one's secret wins.
    const [feed] = await CalendarFeedModel.upsert({ userId: user.id, secret: newSecret(), createdAt: new Date() }, { returning: true });
    return this.toPublic(feed);
  }

  /** The iCalendar text for a secret (no sign-in); 404 for an unknown or rotated one. */
  async ics(secret: string): Promise<string> {
    if (!FEED_SECRET_RE.test(secret)) throw AppError.notFound('No such calendar feed');
    const feed = await CalendarFeedModel.findOne({ where: { secret } });
    const owner = feed && await UserModel.findByPk(feed.userId);
    if (!feed || !owner || owner.disabled) throw AppError.notFound('No such calendar feed');
    const now = this.clock();
    const watches = await WatchModel.findAll({
      where: { ownerId: owner.id, paused: false },
      include: [{ model: SightlineModel, as: 'sightline' }],
      order: [['createdAt', 'ASC']],
    });
    const events: WatchedLineupEvent[] = [];
    for (const watch of watches) {
      const sightline = watch.sightline!;
      let found;
      try {
        found = await this.finder.find(watch, owner, { from: new Date(now.getTime() - DAY_MS), to: new Date(now.getTime() + FEED_HORIZON_DAYS * DAY_MS) });
      } catch (error) {
        // One watch whose sightline can no longer be searched must not empty the whole feed.
        if (error instanceof AppError) continue;
        throw error;
      }
      for (const lineup of found.lineups) {
        if (Date.parse(lineup.end) <= now.getTime()) continue;
        events.push({
          watchId: watch.id,
          sightlineName: sightline.name,
          targetName: found.targetName,
          timezone: found.timezone,
          vantage: { lat: sightline.vantageLat, lon: sightline.vantageLon },
          lineup,
          nightChartUrl: `${this.appUrl}/sightlines/${sightline.id}?tab=night&night=${nightOf(new Date(lineup.start), found.timezone)}`,
        });
      }
    }
    events.sort((a, b) => Date.parse(a.lineup.start) - Date.parse(b.lineup.start));
    return watchedLineupsToIcs(`Gnomon watches (${owner.name})`, events);
  }
}
