import { Op, type Transaction } from 'sequelize';
import type { SightlineInput, SightlineUpdate } from '../../shared/schemas/sightline';
import { timeZoneForSite } from '../../shared/sky/timezone';
import { distanceM, MAX_SIGHTLINE_DISTANCE_M } from '../../shared/geo';
import { AppError } from '../errors';
import { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import { CrewMemberModel } from '../models/crew-member';
import { canAs, forbiddenMessage, roleOnSightline, type SightlineAction } from './access-policy';

const ownerInclude = [{ model: UserModel, as: 'owner', attributes: ['id', 'name'] }];

function columnsFrom(input: Partial<SightlineInput>) {
  return {
    ...(input.name !== undefined ? { name: input.name } : {}),
    ...(input.vantage ? {
      vantageLat: input.vantage.lat, vantageLon: input.vantage.lon,
      vantageElevationM: input.vantage.elevationM, cameraHeightM: input.vantage.cameraHeightM,
      timezone: timeZoneForSite(input.vantage.lat, input.vantage.lon),
    } : {}),
    ...(input.landmark ? {
      landmarkLat: input.landmark.lat, landmarkLon: input.landmark.lon, landmarkBaseElevationM: input.landmark.baseElevationM,
      landmarkHeightM: input.landmark.heightM, landmarkWidthM: input.landmark.widthM,
    } : {}),
    ...(input.bandHeightDeg !== undefined ? { bandHeightDeg: input.bandHeightDeg } : {}),
    ...(input.targetId !== undefined ? { targetId: input.targetId } : {}),
  };
}

/** Shortest vantage-to-landmark distance saved, m: closer than this there is no line of sight to plan. */
const MIN_SAVED_DISTANCE_M = 1;

/** Refuses pins that give no sightline to compute (coinciding, or farther apart than the geometry covers). */
function checkPinDistance(vantage: { lat: number; lon: number }, landmark: { lat: number; lon: number }): void {
  const d = distanceM(vantage, landmark);
  if (d < MIN_SAVED_DISTANCE_M) {
    throw new AppError('validation', 'The vantage and the landmark are in the same place', { landmark: 'Move the landmark away from the vantage' });
  }
  if (d > MAX_SIGHTLINE_DISTANCE_M) {
    throw new AppError('validation', `The landmark is more than ${MAX_SIGHTLINE_DISTANCE_M / 1000} km from the vantage`, { landmark: 'Put the landmark within sight of the vantage' });
  }
}

/** Saved sightlines: the pins, their heights and the site's time zone. */
export class SightlineService {
  /** The user's own sightlines and those shared with them in a crew; an admin may ask for everyone's. */
  async list(user: UserModel, options: { all?: boolean } = {}): Promise<SightlineModel[]> {
    const memberships = await CrewMemberModel.findAll({ where: { userId: user.id } });
    const crewRoles = new Map(memberships.map((m) => [m.sightlineId, m.role]));
    const where = options.all && user.role === 'admin'
      ? {}
      : { [Op.or]: [{ ownerId: user.id }, { id: [...crewRoles.keys()] }] };
    const list = await SightlineModel.findAll({ where, include: ownerInclude, order: [['name', 'ASC']] });
    for (const s of list) s.viewerRole = roleOnSightline(user, s, crewRoles.get(s.id) ?? null);
    return list;
  }

  /** The sightline if the user may do the action; 404 when they may not even read it, 403 otherwise. */
  async get(user: UserModel, id: string, action: SightlineAction = 'read', transaction?: Transaction): Promise<SightlineModel> {
    const sightline = await SightlineModel.findByPk(id, {
      include: ownerInclude,
      transaction,
      // Only the sightline row is locked: PostgreSQL refuses FOR UPDATE on the owner's outer-joined side.
      lock: transaction ? { level: transaction.LOCK.UPDATE, of: SightlineModel } : undefined,
    });
    if (!sightline) throw AppError.notFound('No such sightline');
    const membership = sightline.ownerId === user.id ? null : await CrewMemberModel.findOne({ where: { sightlineId: id, userId: user.id }, transaction });
    const role = roleOnSightline(user, sightline, membership?.role ?? null);
    if (!canAs(role, 'read')) throw AppError.notFound('No such sightline');
    if (!canAs(role, action)) throw new AppError('forbidden', forbiddenMessage(action));
    sightline.viewerRole = role;
    return sightline;
  }

  async create(user: UserModel, input: SightlineInput): Promise<SightlineModel> {
    checkPinDistance(input.vantage, input.landmark);
    const created = await SightlineModel.create({ ownerId: user.id, ...columnsFrom(input) } as SightlineModel['_creationAttributes']);
    return this.get(user, created.id);
  }

  async update(user: UserModel, id: string, change: SightlineUpdate): Promise<SightlineModel> {
    const sightline = await this.get(user, id, 'edit');
    if (change.vantage || change.landmark) {
      checkPinDistance(change.vantage ?? { lat: sightline.vantageLat, lon: sightline.vantageLon }, change.landmark ?? { lat: sightline.landmarkLat, lon: sightline.landmarkLon });
    }
    await sightline.update(columnsFrom(change));
    return this.get(user, id);
  }

  async remove(user: UserModel, id: string): Promise<void> {
    const sightline = await this.get(user, id, 'delete');
    await sightline.destroy();
  }
}
