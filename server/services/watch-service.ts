import { fn, col, Op, type Transaction } from 'sequelize';
import type { WatchInput, WatchUpdate } from '../../shared/schemas/watch';
import { AppError } from '../errors';
import { SightlineModel } from '../models/sightline';
import type { UserModel } from '../models/user';
import { WatchModel } from '../models/watch';
import { WatchDeliveryModel } from '../models/watch-delivery';
import type { SightlineService } from './sightline-service';

const sightlineInclude = [{ model: SightlineModel, as: 'sightline' }];

/** Most watches one person keeps: each costs lineup searches on every scan. */
export const MAX_WATCHES_PER_USER = 100;

/**
 * Who may see and change a watch: its owner only (crews come later). An outsider must not learn
 * that a watch exists, so "not yours" is a 404, as for sightlines.
 */
function canOnWatch(user: UserModel, watch: { ownerId: string }): boolean {
  return watch.ownerId === user.id;
}

function refuseReachableWithoutTideRule(sightline: SightlineModel, reachableOnly: boolean): void {
  if (reachableOnly && !sightline.tideRule) {
    throw new AppError('validation', 'This sightline has no tide rule, so no lineup can be reachable by the tide', {
      reachableOnly: 'Set a tide rule on the sightline first, or allow lineups whatever the tide',
    });
  }
}

/** Watches: create, list, change, pause, delete; and their delivery history. */
export class WatchService {
  constructor(private readonly sightlines: SightlineService) {}

  /** When each watch last sent an e-mail. */
  async lastSentAt(watchIds: readonly string[]): Promise<Map<string, Date>> {
    if (watchIds.length === 0) return new Map();
    const rows = (await WatchDeliveryModel.findAll({
      attributes: ['watchId', [fn('max', col('sent_at')), 'last']],
      where: { watchId: { [Op.in]: [...watchIds] }, status: 'sent' },
      group: ['watchId'],
      raw: true,
    })) as unknown as Array<{ watchId: string; last: Date | string }>;
    return new Map(rows.map((r) => [r.watchId, new Date(r.last)]));
  }

  /** The user's watches, newest first; only one sightline's with `sightlineId`. */
  async list(user: UserModel, options: { sightlineId?: string } = {}): Promise<WatchModel[]> {
    return WatchModel.findAll({
      where: { ownerId: user.id, ...(options.sightlineId ? { sightlineId: options.sightlineId } : {}) },
      include: sightlineInclude,
      order: [['createdAt', 'DESC'], ['id', 'ASC']],
    });
  }

  /** The watch if the user may see it (404 otherwise). */
  async get(user: UserModel, id: string, transaction?: Transaction): Promise<WatchModel> {
    const watch = await WatchModel.findByPk(id, {
      include: sightlineInclude,
      transaction,
      lock: transaction ? { level: transaction.LOCK.UPDATE, of: WatchModel } : undefined,
    });
    if (!watch || !canOnWatch(user, watch)) throw AppError.notFound('No such watch');
    return watch;
  }

  async create(user: UserModel, input: WatchInput): Promise<WatchModel> {
    // Watching needs only read access to the sightline (the access policy's 'read').
    const sightline = await this.sightlines.get(user, input.sightlineId, 'read');
    refuseReachableWithoutTideRule(sightline, input.reachableOnly);
    if ((await WatchModel.count({ where: { ownerId: user.id } })) >= MAX_WATCHES_PER_USER) {
      throw new AppError('conflict', `You keep ${MAX_WATCHES_PER_USER} watches already; delete one first`);
    }
    const created = await WatchModel.create({
      ownerId: user.id,
      sightlineId: sightline.id,
      target: input.target ?? { id: sightline.targetId },
      minScore: input.minScore,
      minDurationMin: input.minDurationMin,
      reachableOnly: input.reachableOnly,
      weekdays: input.weekdays,
      leadDays: input.leadDays,
      paused: input.paused,
      maxCloudPct: input.maxCloudPct,
    });
    return this.get(user, created.id);
  }

  async update(user: UserModel, id: string, change: WatchUpdate): Promise<WatchModel> {
    const watch = await this.get(user, id);
    if (change.reachableOnly) refuseReachableWithoutTideRule(watch.sightline!, true);
    const columns = Object.fromEntries(Object.entries(change).filter(([, v]) => v !== undefined));
    await watch.update(columns);
    return this.get(user, id);
  }

  async remove(user: UserModel, id: string): Promise<void> {
    const watch = await this.get(user, id);
    await watch.destroy();
  }

  /** The watch's e-mails, newest lineup first (at most `limit`). */
  async deliveries(user: UserModel, id: string, limit = 100): Promise<WatchDeliveryModel[]> {
    const watch = await this.get(user, id);
    return WatchDeliveryModel.findAll({ where: { watchId: watch.id }, order: [['lineupStart', 'DESC'], ['leadDays', 'ASC']], limit });
  }
}
