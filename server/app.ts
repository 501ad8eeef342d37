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
import { LocalPhotoStorage } from './storage/local-storage';
import { photosRouter, sightlinePhotosRouter } from './routes/photos';

export interface AppOptions {
  config: Config;
  /** The database the services write to (transactions need the instance). */
  sequelize: Sequelize;
  /** The JWT signing key (from env, or kept under the data folder by the embedded start). */
  jwtSecret: string;
  /** Folder of the built client to serve; omitted in API tests. */
  clientDir?: string;
}

/** Builds the Express app (no listen): API under /api, the built client for everything else. */
export function createApp({ config, sequelize, jwtSecret, clientDir }: AppOptions): Express {
  const tokens = new TokenService(jwtSecret, config.jwtTtlHours);
  const auth = new AuthService(config.bcryptRounds);
  const users = new UserService();
  const sightlines = new SightlineService();
  const notes = new FieldNoteService(sightlines);
  const tides = new TideService(sequelize, sightlines);
  const pool = new EnginePool();
  const lineups = new LineupService(new DarkWindowCache(pool), sightlines, tides, pool);
  // The local folder driver; an S3-compatible driver implements the same PhotoStorage interface.
  const photos = new PhotoService(sequelize, sightlines, new LocalPhotoStorage(config.photoDir), {
    maxPixels: config.photoMaxPixels,
    perSightline: config.photosPerSightline,
  });

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
  api.use('/sightlines', sightlinesRouter({ sightlines, notes, tides, lineups, photos }));
  api.use('/lineups', lineupsRouter({ lineups }));
  api.use(apiNotFound);
  app.use('/api', api);

  if (clientDir && existsSync(join(clientDir, 'index.html'))) {
    const root = resolve(clientDir);
    app.use(express.static(root, { index: false, maxAge: '1h' }));
    // The client's router owns every other path.
    app.get('/{*path}', (_req, res) => { res.sendFile(join(root, 'index.html')); });
  }

  app.use(errorHandler);
  app.locals.shutdown = () => pool.close();
  return app;
}
