import { fn, col, UniqueConstraintError, type Sequelize, type Transaction } from 'sequelize';
import {
  cameraBodySchema,
  lensSchema,
  MAX_GEAR_BODIES,
  MAX_GEAR_LENSES,
  type CameraBody,
  type Lens,
} from '../../shared/schemas/gear';
import type {
  CameraBodyInput,
  CameraBodyPatch,
  GearResponse,
  GearSettings,
  LensInput,
  LensPatch,
} from '../../shared/schemas/shot-plan';
import { AppError, parseOrThrow } from '../errors';
import { CameraBodyModel } from '../models/camera-body';
import { GearSettingsModel } from '../models/gear-settings';
import { LensModel } from '../models/lens';
import { UserModel } from '../models/user';

const PIXEL_FIELDS = ['pixelPitchUm', 'widthPx', 'megapixels'] as const;
const PRIME_FIELDS = ['focalLengthMm'] as const;
const ZOOM_FIELDS = ['zoomMinMm', 'zoomMaxMm'] as const;

/**
 * A stored record with a change laid over it: `null` clears a field, `undefined` keeps it. When the
 * change names any field of a `group`, the group's other fields are cleared too (the change
 * replaces the group), so e.g. a new pixel pitch does not clash with an old pixel count.
 */
function merge<T extends object>(stored: T, change: Record<string, unknown>, groups: ReadonlyArray<readonly string[]>, exclusive: ReadonlyArray<readonly [readonly string[], readonly string[]]> = []): Record<string, unknown> {
  const out: Record<string, unknown> = { ...(stored as Record<string, unknown>) };
  const named = (keys: readonly string[]) => keys.some((k) => change[k] !== undefined);
  for (const group of groups) if (named(group)) for (const k of group) delete out[k];
  // A prime given clears the zoom's ends and the other way round, unless both are named.
  for (const [a, b] of exclusive) {
    if (named(a) && !named(b)) for (const k of b) delete out[k];
    if (named(b) && !named(a)) for (const k of a) delete out[k];
  }
  for (const [k, v] of Object.entries(change)) {
    if (v === null) delete out[k];
    else if (v !== undefined) out[k] = v;
  }
  return out;
}

function nameTaken(kind: 'camera body' | 'lens', name: string): AppError {
  const message = `You already have a ${kind} named "${name}"`;
  return new AppError('conflict', message, { name: message });
}

function bodyColumns(b: CameraBody) {
  return {
    name: b.name,
    sensorWidthMm: b.sensorWidthMm,
    sensorHeightMm: b.sensorHeightMm,
    pixelPitchUm: b.pixelPitchUm ?? null,
    widthPx: b.widthPx ?? null,
    megapixels: b.megapixels ?? null,
  };
}

function lensColumns(l: Lens) {
  return {
    name: l.name,
    focalLengthMm: l.focalLengthMm ?? null,
    zoomMinMm: l.zoomMinMm ?? null,
    zoomMaxMm: l.zoomMaxMm ?? null,
    widestApertureF: l.widestApertureF,
  };
}

/** A user's gear: camera bodies, lenses and settings. Everyone sees and changes only their own. */
export class GearService {
  constructor(private readonly sequelize: Sequelize) {}

  /** The user's bodies (by name), lenses (by shortest focal length, then name) and settings. */
  async list(user: UserModel): Promise<GearResponse> {
    const [bodies, lenses, settings] = await Promise.all([
      CameraBodyModel.findAll({ where: { ownerId: user.id }, order: [[fn('lower', col('name')), 'ASC'], ['createdAt', 'ASC']] }),
      LensModel.findAll({ where: { ownerId: user.id }, order: [[fn('lower', col('name')), 'ASC'], ['createdAt', 'ASC']] }),
      this.settings(user),
    ]);
    const lensList = lenses.map((l) => l.toPublic()).sort((a, b) => a.range.minMm - b.range.minMm || a.range.maxMm - b.range.maxMm);
    return { bodies: bodies.map((b) => b.toPublic()), lenses: lensList, settings };
  }

  /** One of the user's bodies; 404 for a body that is not theirs (as for one that does not exist). */
  async body(user: UserModel, id: string, transaction?: Transaction): Promise<CameraBodyModel> {
    const row = await CameraBodyModel.findOne({ where: { id, ownerId: user.id }, transaction });
    if (!row) throw AppError.notFound('No such camera body in your gear');
    return row;
  }

  /** One of the user's lenses; 404 for a lens that is not theirs. */
  async lens(user: UserModel, id: string, transaction?: Transaction): Promise<LensModel> {
    const row = await LensModel.findOne({ where: { id, ownerId: user.id }, transaction });
    if (!row) throw AppError.notFound('No such lens in your gear');
    return row;
  }

  /** Adds a body (409 for a name the user already has, or a full list). */
  async createBody(user: UserModel, input: CameraBodyInput): Promise<CameraBodyModel> {
    const body = parseOrThrow(cameraBodySchema, input);
    return this.unique('camera body', body.name, () => this.sequelize.transaction(async (transaction) => {
      await this.lockOwner(user, transaction);
      const count = await CameraBodyModel.count({ where: { ownerId: user.id }, transaction });
      if (count >= MAX_GEAR_BODIES) throw new AppError('conflict', `Your gear holds at most ${MAX_GEAR_BODIES} camera bodies; delete one first`);
      return CameraBodyModel.create({ ownerId: user.id, ...bodyColumns(body) }, { transaction });
    }));
  }

  /** Changes a body; the result is checked as a whole (figures must still agree). */
  async updateBody(user: UserModel, id: string, change: CameraBodyPatch): Promise<CameraBodyModel> {
    return this.unique('camera body', change.name ?? '', () => this.sequelize.transaction(async (transaction) => {
      const row = await this.body(user, id, transaction);
      const merged = parseOrThrow(cameraBodySchema, merge(row.toBody(), change, [PIXEL_FIELDS]));
      await row.update(bodyColumns(merged), { transaction });
      return row;
    }));
  }

  async removeBody(user: UserModel, id: string): Promise<void> {
    const row = await this.body(user, id);
    await row.destroy();
  }

  /** Adds a lens (409 for a name the user already has, or a full list). */
  async createLens(user: UserModel, input: LensInput): Promise<LensModel> {
    const lens = parseOrThrow(lensSchema, input);
    return this.unique('lens', lens.name, () => this.sequelize.transaction(async (transaction) => {
      await this.lockOwner(user, transaction);
      const count = await LensModel.count({ where: { ownerId: user.id }, transaction });
      if (count >= MAX_GEAR_LENSES) throw new AppError('conflict', `Your gear holds at most ${MAX_GEAR_LENSES} lenses; delete one first`);
      return LensModel.create({ ownerId: user.id, ...lensColumns(lens) }, { transaction });
    }));
  }

  /** Changes a lens; giving a prime's focal length clears a zoom's ends and the other way round. */
  async updateLens(user: UserModel, id: string, change: LensPatch): Promise<LensModel> {
    return this.unique('lens', change.name ?? '', () => this.sequelize.transaction(async (transaction) => {
      const row = await this.lens(user, id, transaction);
      const merged = parseOrThrow(lensSchema, merge(row.toLens(), change, [], [[PRIME_FIELDS, ZOOM_FIELDS]]));
      await row.update(lensColumns(merged), { transaction });
      return row;
    }));
  }

  async removeLens(user: UserModel, id: string): Promise<void> {
    const row = await this.lens(user, id);
    await row.destroy();
  }

  /** The user's settings (the defaults until they save some). */
  async settings(user: UserModel, transaction?: Transaction): Promise<GearSettings> {
    const row = await GearSettingsModel.findByPk(user.id, { transaction });
    return row ? row.toPublic() : { starTrackerAvailable: false };
  }

  async saveSettings(user: UserModel, settings: GearSettings): Promise<GearSettings> {
    const [row] = await GearSettingsModel.upsert({ userId: user.id, starTrackerAvailable: settings.starTrackerAvailable });
    return row.toPublic();
  }

  /** Serialises creates of one user's gear, so the list limits hold under concurrent requests. */
  private async lockOwner(user: UserModel, transaction: Transaction): Promise<void> {
    await UserModel.findByPk(user.id, { transaction, lock: transaction.LOCK.UPDATE, attributes: ['id'] });
  }

  /** Runs a write, turning the database's per-user unique name into a 409 with a field message. */
  private async unique<T>(kind: 'camera body' | 'lens', name: string, write: () => Promise<T>): Promise<T> {
    try {
      return await write();
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw nameTaken(kind, name.trim());
      throw error;
    }
  }
}
