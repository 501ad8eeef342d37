/**
 * Outings: on a lineup night the owner marks where and when the crew meets and what to bring;
 * crew members answer going / maybe / not going.
 */
import { randomUUID } from 'node:crypto';
import { DateTime } from 'luxon';
import type { Transaction } from 'sequelize';
import type { Outing, OutingAnswerInput, OutingInput, OutingPerson, OutingUpdate } from '../../shared/schemas/outing';
import { AppError } from '../errors';
import { CrewMemberModel } from '../models/crew-member';
import { OutingModel } from '../models/outing';
import { OutingResponseModel } from '../models/outing-response';
import type { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import type { SightlineAction } from './access-policy';
import type { SightlineService } from './sightline-service';

const LOCAL_FORMAT = "yyyy-MM-dd'T'HH:mm";

/** The instant of a wall-clock time in the zone; refuses a time the clocks skip. */
function meetingInstant(local: string, zone: string): Date {
  const at = DateTime.fromFormat(local, LOCAL_FORMAT, { zone });
  if (!at.isValid || at.toFormat(LOCAL_FORMAT) !== local) {
    const message = `${local.replace('T', ' ')} does not exist in ${zone} (the clocks change then); choose another time`;
    throw new AppError('validation', message, { meetingLocal: message });
  }
  return at.toJSDate();
}

/**
 * Refuses a meeting that is not on the outing's night: from 06:00 on the evening's date to 12:00
 * the next day, site time (long drives start in the afternoon; nobody meets after the dawn).
 */
function checkMeetingOnNight(meetingLocal: string, night: string): void {
  const day = DateTime.fromISO(night, { zone: 'UTC' });
  const from = day.toFormat("yyyy-MM-dd'T'06:00");
  const to = day.plus({ days: 1 }).toFormat("yyyy-MM-dd'T'12:00");
  if (meetingLocal < from || meetingLocal > to) {
    const message = `Meet on the night of ${night}: between ${from.replace('T', ' ')} and ${to.replace('T', ' ')} site time`;
    throw new AppError('validation', message, { meetingLocal: message });
  }
}

export class OutingService {
  constructor(private readonly sightlines: SightlineService) {}

  /** The outing and its sightline if the user may do the action there (404 for outsiders). */
  private async find(user: UserModel, outingId: string, action: SightlineAction, transaction?: Transaction): Promise<{ outing: OutingModel; sightline: SightlineModel }> {
    const outing = await OutingModel.findByPk(outingId, { transaction });
    if (!outing) throw AppError.notFound('No such outing');
    try {
      const sightline = await this.sightlines.get(user, outing.sightlineId, action, transaction);
      return { outing, sightline };
    } catch (error) {
      if (error instanceof AppError && error.code === 'not_found') throw AppError.notFound('No such outing');
      throw error;
    }
  }

  async create(user: UserModel, sightlineId: string, input: OutingInput): Promise<Outing> {
    const sightline = await this.sightlines.get(user, sightlineId, 'plan-outing');
    checkMeetingOnNight(input.meetingLocal, input.night);
    const outing = await OutingModel.create({
      id: randomUUID(),
      sightlineId,
      createdBy: user.id,
      night: input.night,
      lineupStart: input.lineup?.start ?? null,
      lineupEnd: input.lineup?.end ?? null,
      lineupPeak: input.lineup?.peak ?? null,
      meetingLat: input.meetingPoint.lat,
      meetingLon: input.meetingPoint.lon,
      meetingAt: meetingInstant(input.meetingLocal, sightline.timezone),
      meetingNote: input.meetingNote,
      gearNotes: input.gearNotes,
    });
    return this.toPublic(outing, sightline);
  }

  /** The sightline's outings, soonest night first. */
  async list(user: UserModel, sightlineId: string): Promise<Outing[]> {
    const sightline = await this.sightlines.get(user, sightlineId, 'read');
    const outings = await OutingModel.findAll({ where: { sightlineId }, order: [['night', 'ASC'], ['meetingAt', 'ASC']] });
    return Promise.all(outings.map((o) => this.toPublic(o, sightline)));
  }

  async get(user: UserModel, outingId: string): Promise<Outing> {
    const { outing, sightline } = await this.find(user, outingId, 'read');
    return this.toPublic(outing, sightline);
  }

  async update(user: UserModel, outingId: string, change: OutingUpdate): Promise<Outing> {
    const { outing, sightline } = await this.find(user, outingId, 'plan-outing');
    if (change.meetingLocal) checkMeetingOnNight(change.meetingLocal, outing.night);
    await outing.update({
      ...(change.meetingPoint ? { meetingLat: change.meetingPoint.lat, meetingLon: change.meetingPoint.lon } : {}),
      ...(change.meetingLocal ? { meetingAt: meetingInstant(change.meetingLocal, sightline.timezone) } : {}),
      ...(change.meetingNote !== undefined ? { meetingNote: change.meetingNote } : {}),
      ...(change.gearNotes !== undefined ? { gearNotes: change.gearNotes } : {}),
    });
    return this.toPublic(outing, sightline);
  }

  async remove(user: UserModel, outingId: string): Promise<void> {
    const { outing } = await this.find(user, outingId, 'plan-outing');
    await outing.destroy();
  }

  /** Saves the user's answer (one per person, replaced on a new answer). */
  async answer(user: UserModel, outingId: string, input: OutingAnswerInput): Promise<Outing> {
    const { outing, sightline } = await this.find(user, outingId, 'answer-outing');
    await OutingResponseModel.upsert({ outingId: outing.id, userId: user.id, answer: input.answer, note: input.note, updatedAt: new Date() });
    return this.toPublic(outing, sightline);
  }

  private async toPublic(outing: OutingModel, sightline: SightlineModel): Promise<Outing> {
    const [members, responses, owner, creator] = await Promise.all([
      CrewMemberModel.findAll({ where: { sightlineId: sightline.id }, include: [{ model: UserModel, as: 'user', attributes: ['id', 'name'] }] }),
      OutingResponseModel.findAll({ where: { outingId: outing.id } }),
      UserModel.findByPk(sightline.ownerId, { attributes: ['id', 'name'] }),
      outing.createdBy ? UserModel.findByPk(outing.createdBy, { attributes: ['id', 'name'] }) : null,
    ]);
    const byUser = new Map(responses.map((r) => [r.userId, r]));
    const person = (userId: string, name: string, role: OutingPerson['role']): OutingPerson => {
      const r = byUser.get(userId);
      return { userId, name, role, answer: r?.answer ?? null, note: r?.note ?? '', answeredAt: r?.updatedAt.toISOString() ?? null };
    };
    const people = [
      person(sightline.ownerId, owner?.name ?? '', 'owner'),
      ...members.map((m) => person(m.userId, m.user?.name ?? '', m.role)).sort((a, b) => a.name.localeCompare(b.name)),
    ];
    const zone = sightline.timezone;
    return {
      id: outing.id,
      sightlineId: sightline.id,
      sightlineName: sightline.name,
      timezone: zone,
      night: outing.night,
      lineup: outing.lineupStart && outing.lineupEnd && outing.lineupPeak
        ? { start: outing.lineupStart.toISOString(), end: outing.lineupEnd.toISOString(), peak: outing.lineupPeak.toISOString() }
        : null,
      meetingPoint: { lat: outing.meetingLat, lon: outing.meetingLon },
      meetingAt: outing.meetingAt.toISOString(),
      meetingLocal: DateTime.fromJSDate(outing.meetingAt, { zone }).toFormat(LOCAL_FORMAT),
      meetingNote: outing.meetingNote,
      gearNotes: outing.gearNotes,
      createdByName: creator?.name ?? 'former member',
      people,
      createdAt: outing.createdAt.toISOString(),
      updatedAt: outing.updatedAt.toISOString(),
    };
  }
}
