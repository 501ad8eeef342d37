import { Op, type Sequelize } from 'sequelize';
import { isCleanTideParse, parseTideTimes, type TideEvent, type TideRule } from '../../shared/tide';
import { ENGINE_MAX_UNIX_MS, ENGINE_MIN_UNIX_MS } from '../../shared/lineup/time';
import { AppError } from '../errors';
import type { SightlineModel } from '../models/sightline';
import { TideEventModel } from '../models/tide-event';
import type { UserModel } from '../models/user';
import type { SightlineService } from './sightline-service';

const REPLACE_MARGIN_MS = 3 * 3600_000;

export interface PasteResult {
  events: TideEvent[];
  warnings: Array<{ line: number; text: string; message: string }>;
}

/** A sightline's tide rule and tide times. */
export class TideService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly sightlines: SightlineService,
  ) {}

  async setRule(user: UserModel, sightlineId: string, rule: TideRule | null): Promise<SightlineModel> {
    // PostgreSQL's jsonb cannot hold a NUL character: refuse it here rather than fail on save.
    if (rule?.note?.includes('\u0000')) throw new AppError('validation', 'Some fields need attention', { 'rule.note': 'The note has a character that cannot be stored' });
    const sightline = await this.sightlines.get(user, sightlineId, 'edit');
    await sightline.update({ tideRule: rule });
    return sightline;
  }

  /** Tide events of the sightline, optionally within [from, to], by time. */
  async events(user: UserModel, sightlineId: string, range: { from?: Date; to?: Date } = {}): Promise<TideEvent[]> {
    await this.sightlines.get(user, sightlineId, 'read');
    return this.eventsUnchecked(sightlineId, range);
  }

  /** Same as events() for a caller that already checked access. */
  async eventsUnchecked(sightlineId: string, range: { from?: Date; to?: Date } = {}): Promise<TideEvent[]> {
    const at = {
      ...(range.from ? { [Op.gte]: range.from } : {}),
      ...(range.to ? { [Op.lte]: range.to } : {}),
    };
    const rows = await TideEventModel.findAll({
      where: { sightlineId, ...(range.from || range.to ? { at } : {}) },
      order: [['at', 'ASC']],
    });
    return rows.map((r) => r.toPublic());
  }

  /**
   * Reads pasted tide times (local times in the site's zone). Any unreadable line refuses the
   * whole paste, with a message per line, and nothing is saved. A clean paste replaces the stored
   * events within its own time span (plus 3 h each side), in one transaction.
   */
  async paste(user: UserModel, sightlineId: string, text: string): Promise<PasteResult> {
    const sightline = await this.sightlines.get(user, sightlineId, 'edit');
    const parsed = parseTideTimes(text, sightline.timezone);
    if (!isCleanTideParse(parsed)) {
      const fields = Object.fromEntries(parsed.errors.slice(0, 200).map((e) => [`lines.${e.line}`, `Line ${e.line}: ${e.message}`]));
      throw new AppError('validation', `${parsed.errors.length} line(s) could not be read; nothing was saved`, fields);
    }
    if (parsed.events.length === 0) {
      throw new AppError('validation', 'No tide times found in the text', { text: 'Paste lines such as "2027-05-04 03:12 L 0.4"' });
    }
    // A corrected time can move a few minutes either way, so the replaced span reaches half the
    // usual spacing of tides (about 6 h 12 min, common practice) beyond the first and last event.
    const first = new Date(Date.parse(parsed.events[0]!.at) - REPLACE_MARGIN_MS);
    const last = new Date(Date.parse(parsed.events[parsed.events.length - 1]!.at) + REPLACE_MARGIN_MS);
    const outside = parsed.events.find((e) => Date.parse(e.at) < ENGINE_MIN_UNIX_MS || Date.parse(e.at) > ENGINE_MAX_UNIX_MS);
    if (outside) {
      throw new AppError('validation', 'Tide times must lie between 1900 and 2200; nothing was saved', { text: `${outside.at} is outside 1900..2200` });
    }
    await this.sequelize.transaction(async (transaction) => {
      // The sightline row is locked so that pastes over the same span run one after the other
      // (two deletes before two inserts would break the one-event-per-instant constraint).
      await this.sightlines.get(user, sightlineId, 'edit', transaction);
      await TideEventModel.destroy({ where: { sightlineId, at: { [Op.between]: [first, last] } }, transaction });
      await TideEventModel.bulkCreate(
        parsed.events.map((e) => ({ sightlineId, at: new Date(e.at), kind: e.kind, heightM: e.heightM ?? null })),
        { transaction },
      );
    });
    return { events: await this.eventsUnchecked(sightlineId), warnings: parsed.warnings };
  }

  async clear(user: UserModel, sightlineId: string): Promise<void> {
    await this.sightlines.get(user, sightlineId, 'edit');
    await TideEventModel.destroy({ where: { sightlineId } });
  }
}
