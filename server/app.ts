import { existsSync } from 'node:fs';
import { join, resolve } from 'node:path';
import express, { type Express } from 'express';
import type { Sequelize } from 'sequelize';
import cookieParser from 'cookie-parser';
import helmet from 'helmet';
import type { Config } from './config';
import { authenticate } from './middleware/auth';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { authRouter } from './routes/auth';
import { usersRouter } from './routes/users';
import { sightlinesRouter } from './routes/sightlines';
import { FieldNoteService } from './services/field-note-service';
import { SightlineService } from './services/sightline-service';
import { TideService } from './services/tide-service';
import { DarkWindowCache } from './services/dark-window-cache';
import { LineupService } from './services/lineup-service';
import { lineupsRouter } from './routes/lineups';
import { EnginePool } from './workers/engine-pool';
import { AuthService } from './services/auth-service';
import { TokenService } from './services/token-service';
import { UserService } from './services/user-service';
import { PhotoService } from './services/photo-service';
import { createPhotoStorage, type PhotoStorage } from './storage';
import { ForecastClient } from './forecast/client';
import { ForecastService } from './forecast/forecast-service';
import { outlookRouter, sightlineOutlookRouter } from './routes/outlook';
import { CrewService } from './services/crew-service';
import { InviteService } from './services/invite-service';
import { OutingService } from './services/outing-service';
import { crewRouter, invitesRouter } from './routes/crew';
import { outingsRouter, sightlineOutingsRouter } from './routes/outings';
import { GearService } from './services/gear-service';
import { ShotCardService } from './services/shot-card-service';
import { gearRouter } from './routes/gear';
import { shotPlanRouter } from './routes/shot-plan';
import { photosRouter, sightlinePhotosRouter } from './routes/photos';
import { createSmtpMailer, createUnconfiguredMailer } from './mail/mailer';
import { defaultSchedulerOptions, systemClock, WatchScheduler, type Clock, type WatchSchedulerOptions } from './jobs/watch-scheduler';
import { WatchService } from './services/watch-service';
import { WatchLineups } from './services/watch-lineups';
import { WatchDeliveryService } from './services/watch-delivery-service';
import { UnsubscribeTokens } from './services/unsubscribe-tokens';
import { UnsubscribeService } from './services/unsubscribe-service';
import { CalendarFeedService } from './services/calendar-feed-service';
import { OutboxService } from './services/outbox-service';
import { unsubscribeRouter, watchesRouter } from './routes/watches';
import { outboxRouter } from './routes/outbox';
import { calendarRouter } from './routes/calendar';

export interface AppOptions {
  config: Config;
  /** The database the services write to (transactions need the instance). */
  sequelize: Sequelize;
  /** The JWT signing key (from env, or kept under the data folder by the embedded start). */
  jwtSecret: string;
  /** Folder of the built client to serve; omitted in API tests. */
  clientDir?: string;
  /** The clock of watches and the calendar feed (tests pass a fake one). */
  clock?: Clock;
  /** Watch scheduler settings beyond the config (tests shorten the retry delays). */
  watchScheduler?: Partial<Omit<WatchSchedulerOptions, 'clock'>>;
  /** Photo storage to use instead of the configured one (tests). */
  photoStorage?: PhotoStorage;
}

/** A claim on a delivery older than this is taken as abandoned by a sender that died. */
const DELIVERY_CLAIM_LEASE_MS = 10 * 60_000;

/** The app's watch scheduler (built by createApp, started by startServer when watches are on). */
export function watchSchedulerOf(app: Express): WatchScheduler {
  return app.locals.watchScheduler as WatchScheduler;
}

/** Builds the Express app (no listen): API under /api, the built client for everything else. */
export function createApp({ config, sequelize, jwtSecret, clientDir, clock = systemClock, watchScheduler, photoStorage }: AppOptions): Express {
  const tokens = new TokenService(jwtSecret, config.jwtTtlHours);
  const auth = new AuthService(config.bcryptRounds);
  const users = new UserService();
  const sightlines = new SightlineService();
  const notes = new FieldNoteService(sightlines);
  const tides = new TideService(sequelize, sightlines);
  const pool = new EnginePool();
  const lineups = new LineupService(new DarkWindowCache(pool), sightlines, tides, pool);
  // A local folder by default, or S3-compatible object storage (PHOTO_STORAGE=s3).
  const photos = new PhotoService(sequelize, sightlines, photoStorage ?? createPhotoStorage(config.photoStorage), {
    maxPixels: config.photoMaxPixels,
    perSightline: config.photosPerSightline,
  });

  // Sky outlook: the forecast service (the local fake under `npm start`), cached in PostgreSQL; on
  // the watches' clock, so the outlook in a watch e-mail is the one for the scheduler's "now".
  const forecast = new ForecastService({
    source: config.forecastBaseUrl ? new ForecastClient({ baseUrl: config.forecastBaseUrl, timeoutMs: config.forecastTimeoutMs, now: clock }) : null,
    sightlines,
    now: clock,
  });

  // Watches: e-mails through SMTP_URL (the local fake under `npm start`), a pg-boss scheduler.
  const mailer = config.smtpUrl ? createSmtpMailer(config.smtpUrl) : createUnconfiguredMailer();
  const watches = new WatchService(sightlines);
  const watchLineups = new WatchLineups(lineups);
  const unsubscribeTokens = new UnsubscribeTokens(jwtSecret);
  const schedulerOptions = { ...defaultSchedulerOptions, scanIntervalSeconds: config.watchScanIntervalSeconds, ...watchScheduler, clock };
  const deliveries = new WatchDeliveryService(sequelize, watchLineups, mailer, unsubscribeTokens, {
    mailFrom: config.mailFrom,
    appUrl: config.appUrl,
    maxAttempts: schedulerOptions.retryLimit + 1,
    claimLeaseMs: DELIVERY_CLAIM_LEASE_MS,
    // Longer than the longest back-off wait, so a row waiting for its retry is not taken as lost.
    orphanAfterMs: Math.max(30 * 60_000, 2 * schedulerOptions.retryDelaySeconds * 2 ** schedulerOptions.retryLimit * 1000),
  }, forecast);
  const scheduler = new WatchScheduler(sequelize, deliveries, schedulerOptions);
  const unsubscribe = new UnsubscribeService(sequelize, unsubscribeTokens);
  const feeds = new CalendarFeedService(sequelize, watchLineups, config.appUrl, clock);
  const outbox = new OutboxService();
  const gear = new GearService(sequelize);
  const shotCards = new ShotCardService(sightlines, tides, gear, clock);

  // Crews: members and roles, e-mail invites through the same mailer, outings.
  const crew = new CrewService(sequelize, sightlines, clock);
  const invites = new InviteService(sequelize, sightlines, mailer, { appUrl: config.appUrl, mailFrom: config.mailFrom, jwtSecret, clock });
  const outings = new OutingService(sightlines);

  const app = express();
  app.disable('x-powered-by');
  app.use(helmet({
    contentSecurityPolicy: {
      directives: {
        // Map tiles come from the configured tile server; everything else from this origin.
        'img-src': ["'self'", 'data:', 'blob:', 'https:'],
        'upgrade-insecure-requests': null,
      },
    },
  }));

  const api = express.Router();
  api.use(express.json({ limit: '256kb' }));
  api.use(cookieParser());
  api.use(authenticate(tokens, users));
  api.get('/health', (_req, res) => { res.json({ ok: true }); });
  api.use('/auth', authRouter({ config, auth, tokens }));
  api.use('/users', usersRouter({ users }));
  api.use('/sightlines/:id/photos', sightlinePhotosRouter({ photos, maxBytes: config.photoMaxBytes }));
  api.use('/photos', photosRouter({ photos }));
  api.use('/sightlines/:id/outlook', sightlineOutlookRouter({ forecast }));
  api.use('/sightlines/:id/crew', crewRouter({ crew, invites }));
  api.use('/sightlines/:id/outings', sightlineOutingsRouter({ outings }));
  api.use('/gear', gearRouter({ gear }));
  // Only POST shot-plan and shot-card; every other /sightlines/:id path falls through.
  api.use('/sightlines/:id', shotPlanRouter({ shotCards }));
  api.use('/sightlines', sightlinesRouter({ sightlines, notes, tides, lineups, photos }));
  api.use('/lineups', lineupsRouter({ lineups }));
  api.use('/outlook', outlookRouter({ forecast }));
  api.use('/invites', invitesRouter({ invites }));
  api.use('/outings', outingsRouter({ outings }));
  // The pause link works without signing in: mounted before the signed-in watch routes.
  api.use('/watches/unsubscribe', unsubscribeRouter({ unsubscribe }));
  api.use('/watches', watchesRouter({ watches }));
  api.use('/calendar', calendarRouter({ feeds }));
  api.use('/outbox', outboxRouter({ outbox }));
  api.use(apiNotFound);
  app.use('/api', api);

  if (clientDir && existsSync(join(clientDir, 'index.html'))) {
    const root = resolve(clientDir);
    app.use(express.static(root, { index: false, maxAge: '1h' }));
    // The client's router owns every other path.
    app.get('/{*path}', (_req, res) => { res.sendFile(join(root, 'index.html')); });
  }

  app.use(errorHandler);
  app.locals.watchScheduler = scheduler;
  app.locals.shutdown = async () => {
    await scheduler.stop();
    mailer.close();
    await pool.close();
  };
  return app;
}
