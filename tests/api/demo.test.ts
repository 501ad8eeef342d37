import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { demoAccounts, demoSightlines, seedDemo } from '../../server/seeders/demo';
import { SightlineModel } from '../../server/models/sightline';
import { TideEventModel } from '../../server/models/tide-event';
import { UserModel } from '../../server/models/user';
import { AuthService } from '../../server/services/auth-service';
import { createTestContext, createUser, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => { ctx = await createTestContext(); });
afterAll(async () => { await ctx.db.close(); });

describe('demo seeding', () => {
  it('creates the demo accounts and sightlines once, with tide times for a month, and is idempotent', async () => {
    const outsider = await createUser('member', 'Not Demo');
    const before = await UserModel.count();
    const auth = new AuthService(4);
    const first = await seedDemo(auth, ctx.db.sequelize);
    expect(first).toBe(demoAccounts.length + demoSightlines.length);
    expect(await UserModel.count()).toBe(before + demoAccounts.length);
    const second = await seedDemo(auth, ctx.db.sequelize);
    expect(second).toBe(0);
    expect(await UserModel.count()).toBe(before + demoAccounts.length);
    expect(await SightlineModel.count({ where: { ownerId: outsider.id } })).toBe(0);
    const admin = await UserModel.findOne({ where: { email: demoAccounts[0]!.email } });
    expect(admin?.role).toBe('admin');

    // Each sightline with tides has about two highs and two lows a day for 31 days.
    const cove = await SightlineModel.findOne({ where: { name: demoSightlines[0]!.input.name } });
    const count = await TideEventModel.count({ where: { sightlineId: cove!.id } });
    expect(count).toBeGreaterThan(31 * 3.8);
    expect(count).toBeLessThan(31 * 4 + 2);
  });
});
