/**
 * Shared set-up of the watch tests: the real app with a fake clock, the local SMTP fake on a free
 * port, and a scheduler with tight retry delays, so weeks of watches run in seconds. Tests of the
 * sky outlook add the local forecast fake's address (FORECAST_BASE_URL) through `env`.
 */
import type { Express } from 'express';
import type request from 'supertest';
import { simpleParser, type ParsedMail } from 'mailparser';
import { Op } from 'sequelize';
import { createApp, watchSchedulerOf } from '../../server/app';
import { loadConfig, type Config } from '../../server/config';
import type { Database } from '../../server/db/database';
import type { WatchScheduler } from '../../server/jobs/watch-scheduler';
import type { SmtpFake } from '../../server/mail/smtp-fake';
import { OutboxMessageModel } from '../../server/models/outbox-message';
import { lineupSearchResponseSchema, type Lineup } from '../../shared/schemas/lineup';
import { sightlineResponseSchema, type Sightline } from '../../shared/schemas/sightline';
import { TEST_JWT_SECRET } from './helpers';

export const APP_URL = 'http://gnomon.test:8080';

/** A clock the test moves by hand. */
export class FakeClock {
  constructor(private current: Date) {}
  readonly now = (): Date => new Date(this.current.getTime());
  set(at: Date | string): void {
    this.current = new Date(at);
  }
}

export interface WatchApp {
  app: Express;
  config: Config;
  scheduler: WatchScheduler;
  /** Stops the scheduler and the app's pools (not the database). */
  close(): Promise<void>;
}

/** One app copy on the test database, its mail going to the fake; `env` adds settings (e.g. FORECAST_BASE_URL). */
export function createWatchApp(db: Database, clock: FakeClock, fake: SmtpFake, env: Record<string, string> = {}): WatchApp {
  const config = loadConfig({ NODE_ENV: 'test', BCRYPT_ROUNDS: '4', SMTP_URL: fake.url, APP_URL, WATCH_SCAN_INTERVAL_SECONDS: '3600', ...env });
  const app = createApp({
    config,
    sequelize: db.sequelize,
    jwtSecret: TEST_JWT_SECRET,
    clock: clock.now,
    // pg-boss's smallest retry delay is 1 s (back-off doubles it); its fastest polling 0.5 s.
    watchScheduler: { retryDelaySeconds: 1, retryLimit: 4, pollingIntervalSeconds: 0.5, log: false },
  });
  return {
    app,
    config,
    scheduler: watchSchedulerOf(app),
    close: () => (app.locals.shutdown as () => Promise<void>)(),
  };
}

/**
 * An invented sightline at 35 deg S (Australia/Sydney, UTC+10 in June): the landmark lies to the
 * west-south-west, where the galactic centre sinks before dawn in the southern winter.
 */
export const southSightline = {
  name: 'Test ridge at 35 S',
  vantage: { lat: -35.0, lon: 149.0, elevationM: 5, cameraHeightM: 1.5 },
  landmark: { lat: -35.0031, lon: 148.9897, baseElevationM: 0, heightM: 40, widthM: 400 },
  bandHeightDeg: 40,
  targetId: 'galactic-centre',
};

export async function createSightline(agent: request.Agent, body: object = southSightline): Promise<Sightline> {
  const res = await agent.post('/api/sightlines').send(body);
  if (res.status !== 201) throw new Error(`sightline: ${res.status} ${JSON.stringify(res.body)}`);
  return sightlineResponseSchema.parse(res.body).sightline;
}

/** The lineups the planner's own search finds on the sightline, to compare the watch with. */
export async function searchLineups(agent: request.Agent, sightlineId: string, from: string, to: string, minDurationMin = 5): Promise<{ lineups: Lineup[]; timezone: string }> {
  const res = await agent.post('/api/lineups/search').send({
    sightlineId, target: { id: 'galactic-centre' }, from, to, conditions: { sunMaxAltDeg: -18, moon: 'down', minDurationMin },
  });
  if (res.status !== 200) throw new Error(`search: ${res.status} ${JSON.stringify(res.body)}`);
  return lineupSearchResponseSchema.parse(res.body);
}

/** The messages the fake stored for one recipient, oldest first, parsed. */
export async function mailsTo(address: string): Promise<Array<{ row: OutboxMessageModel; mail: ParsedMail }>> {
  const rows = await OutboxMessageModel.findAll({ where: { envelopeTo: { [Op.contains]: [address] } }, order: [['receivedAt', 'ASC']] });
  return Promise.all(rows.map(async (row) => ({ row, mail: await simpleParser(row.raw) })));
}

/** Waits until the check holds (polling), or fails after `timeoutMs`. */
export async function waitFor(check: () => Promise<boolean>, timeoutMs = 15_000, what = 'condition'): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await check())) {
    if (Date.now() > deadline) throw new Error(`Timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** One scan through the queue, then wait until every job it caused is done. */
export async function scanAndDrain(scheduler: WatchScheduler): Promise<void> {
  await scheduler.scanNow();
  await scheduler.drain(30_000);
}
