/**
 * Demo gear: invented camera bodies and lenses for the demo accounts (no makes or models, names of
 * our own), and who has a star tracker. Idempotent: a piece of gear is added only when its owner
 * has none of that name, and a demo person's own changes are never undone.
 */
import type { Sequelize } from 'sequelize';
import type { CameraBodyInput, LensInput } from '../../shared/schemas/shot-plan';
import { cameraBodySchema, lensSchema } from '../../shared/schemas/gear';
import { CameraBodyModel } from '../models/camera-body';
import { GearSettingsModel } from '../models/gear-settings';
import { LensModel } from '../models/lens';
import { UserModel } from '../models/user';

interface DemoGear {
  email: string;
  bodies: CameraBodyInput[];
  lenses: LensInput[];
  starTrackerAvailable: boolean;
}

/** The demo accounts' gear (the accounts themselves come from ./demo.ts). */
export const demoGear: readonly DemoGear[] = [
  {
    email: 'tomas@demo.gnomon.test',
    bodies: [
      { name: 'Old faithful (full frame)', sensorWidthMm: 35.9, sensorHeightMm: 23.9, megapixels: 24.2 },
      { name: 'Travel body (APS-C)', sensorWidthMm: 23.5, sensorHeightMm: 15.6, widthPx: 6000 },
    ],
    lenses: [
      { name: 'Wide prime for the core', focalLengthMm: 14, widestApertureF: 1.8 },
      { name: 'Everyday zoom', zoomMinMm: 24, zoomMaxMm: 70, widestApertureF: 2.8 },
      { name: 'Short tele for the stack', focalLengthMm: 85, widestApertureF: 1.8 },
    ],
    starTrackerAvailable: true,
  },
  {
    email: 'priya@demo.gnomon.test',
    bodies: [{ name: 'Night body', sensorWidthMm: 36, sensorHeightMm: 24, pixelPitchUm: 5.9 }],
    lenses: [
      { name: 'Twenty-four', focalLengthMm: 24, widestApertureF: 1.4 },
      { name: 'Ultra-wide zoom', zoomMinMm: 12, zoomMaxMm: 24, widestApertureF: 2.8 },
    ],
    starTrackerAvailable: false,
  },
];

/**
 * Adds the demo gear that is missing for the demo accounts that exist (others are skipped).
 * @param sequelize - the database (each person's gear is added in one transaction)
 * @param gear - the gear to seed (default: {@link demoGear}); tests pass their own owners
 * @returns how many bodies and lenses were created
 */
export async function seedDemoGear(sequelize: Sequelize, gear: readonly DemoGear[] = demoGear): Promise<number> {
  let created = 0;
  for (const person of gear) {
    const user = await UserModel.findOne({ where: { email: person.email } });
    if (!user) continue;
    created += await sequelize.transaction(async (transaction) => {
      let count = 0;
      for (const input of person.bodies) {
        const body = cameraBodySchema.parse(input);
        const [, made] = await CameraBodyModel.findOrCreate({
          where: { ownerId: user.id, name: body.name },
          defaults: {
            ownerId: user.id,
            name: body.name,
            sensorWidthMm: body.sensorWidthMm,
            sensorHeightMm: body.sensorHeightMm,
            pixelPitchUm: body.pixelPitchUm ?? null,
            widthPx: body.widthPx ?? null,
            megapixels: body.megapixels ?? null,
          },
          transaction,
        });
        if (made) count += 1;
      }
      for (const input of person.lenses) {
        const lens = lensSchema.parse(input);
        const [, made] = await LensModel.findOrCreate({
          where: { ownerId: user.id, name: lens.name },
          defaults: {
            ownerId: user.id,
            name: lens.name,
            focalLengthMm: lens.focalLengthMm ?? null,
            zoomMinMm: lens.zoomMinMm ?? null,
            zoomMaxMm: lens.zoomMaxMm ?? null,
            widestApertureF: lens.widestApertureF,
          },
          transaction,
        });
        if (made) count += 1;
      }
      await GearSettingsModel.findOrCreate({
        where: { userId: user.id },
        defaults: { userId: user.id, starTrackerAvailable: person.starTrackerAvailable },
        transaction,
      });
      return count;
    });
  }
  return created;
}
