import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts, demoSightlines, seedDemo } from '../../server/seeders/demo';
import { SightlineModel } from '../../server/models/sightline';
import { TideEventModel } from '../../server/models/tide-event';
import { UserModel } from '../../server/models/user';
import { AuthService } from '../../server/services/auth-service';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CrewMemberModel } from '../../server/models/crew-member';
import { OutingModel } from '../../server/models/outing';
import { PhotoModel } from '../../server/models/photo';
import { LocalPhotoStorage } from '../../server/storage/local-storage';
import { sightlineGeometry } from '../../shared/geo';
import { skyToPixel } from '../../shared/projection';
import { createTestContext, createUser, type TestContext } from './helpers';

let ctx: TestContext;
let photoDir: string;
beforeAll(async () => {
  ctx = await createTestContext();
  photoDir = mkdtempSync(join(tmpdir(), 'gnomon-test-demo-photos-'));
});
afterAll(async () => {
  await ctx.db.close();
  rmSync(photoDir, { recursive: true, force: true });
});

describe('demo seeding', () => {
  it('creates the demo accounts and sightlines once, with tide times for a month, and is idempotent', async () => {
    const outsider = await createUser('member', 'Not Demo');
    const before = await UserModel.count();
    const auth = new AuthService(4);
    const first = await seedDemo(auth, ctx.db.sequelize, { photoStorage: new LocalPhotoStorage(photoDir) });
    expect(first).toBe(demoAccounts.length + demoSightlines.length);
    expect(await UserModel.count()).toBe(before + demoAccounts.length);
    const second = await seedDemo(auth, ctx.db.sequelize, { photoStorage: new LocalPhotoStorage(photoDir) });
    expect(second).toBe(0);
    expect(await UserModel.count()).toBe(before + demoAccounts.length);
    expect(await SightlineModel.count({ where: { ownerId: outsider.id } })).toBe(0);
    const admin = await UserModel.findOne({ where: { email: demoAccounts[0]!.email } });
    expect(admin?.role).toBe('admin');

    // Each sightline with tides has about two highs and two lows a day for 31 days.
    // The demo owner's own cove (another test file may name a sightline of its own the same).
    const coveOwner = await UserModel.findOne({ where: { email: demoSightlines[0]!.ownerEmail } });
    const cove = await SightlineModel.findOne({ where: { name: demoSightlines[0]!.input.name, ownerId: coveOwner!.id } });
    const count = await TideEventModel.count({ where: { sightlineId: cove!.id } });
    expect(count).toBeGreaterThan(31 * 3.8);
    expect(count).toBeLessThan(31 * 4 + 2);

    // The cove has a crew member, an outing and a calibrated daytime photo, made once.
    expect(await CrewMemberModel.count({ where: { sightlineId: cove!.id } })).toBe(1);
    expect(await OutingModel.count({ where: { sightlineId: cove!.id } })).toBe(1);
    const photos = await PhotoModel.findAll({ where: { sightlineId: cove!.id } });
    expect(photos).toHaveLength(1);
    const calibration = photos[0]!.calibration!;
    // The drawn stack's top is where the landmark top projects with the saved pose; the camera is level.
    const g = sightlineGeometry(cove!.toPublic().vantage, cove!.toPublic().landmark);
    const top = skyToPixel(calibration.pose, { azimuthDeg: g.trueBearingDeg, altitudeDeg: g.topElevationDeg });
    expect(top.x).toBeCloseTo(calibration.landmarkTopPx.x, 3);
    expect(top.y).toBeCloseTo(calibration.landmarkTopPx.y, 3);
    expect(Math.abs(calibration.pose.rollDeg)).toBeLessThan(1e-6);
    expect(photos[0]!.exif.focalLength35Mm).toBe(24);
  });
});
