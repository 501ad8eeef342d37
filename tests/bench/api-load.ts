/**
 * The search API under load: autocannon on loopback against the real app (its own process, as
 * `npm run serve` runs it) and a throwaway PostgreSQL, measuring a cached search while long
 * (10-year, uncached) searches run beside it. Bounded in time and count; every request goes to
 * 127.0.0.1.
 */
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import autocannon from 'autocannon';
import { spawn } from 'node:child_process';
import { EmbeddedPostgres, findFreePort } from '../../server/db/embedded-postgres';
import { openDatabase } from '../../server/db/database';
import { seedDemo, DEMO_PASSWORD, demoAccounts } from '../../server/seeders/demo';
import { AuthService } from '../../server/services/auth-service';

export interface ApiLoadFigures {
  requestsPerSecond: number;
  p50Ms: number;
  p99Ms: number;
  errors: number;
  longSearchesDone: number;
  longSearchMedianMs: number;
}

const LOAD_SECONDS = 10;
const CONNECTIONS = 20;

export async function runApiLoadBench(log: (line: string) => void = console.log): Promise<ApiLoadFigures> {
  const root = mkdtempSync(join(tmpdir(), 'gnomon-bench-pg-'));
  chmodSync(root, 0o755);
  const pg = new EmbeddedPostgres({ dataDir: join(root, 'data'), socketDir: join(root, 'run'), port: await findFreePort(), ephemeral: true, log: () => undefined });
  await pg.start();
  try {
    await pg.ensureDatabase('gnomon_bench');
    const databaseUrl = pg.url('gnomon_bench');
    const db = await openDatabase(databaseUrl);
    await seedDemo(new AuthService(4), db.sequelize);
    await db.close();

    const port = await findFreePort();
    const server = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
      env: { ...process.env, NODE_ENV: 'production', HOST: '127.0.0.1', PORT: String(port), DATABASE_URL: databaseUrl, JWT_SECRET: 'bench-secret-long-enough-for-hs256-signing' },
      stdio: ['ignore', 'ignore', 'inherit'],
    });
    const running = { url: `http://127.0.0.1:${port}` };
    try {
      for (let i = 0; i < 150; i += 1) {
        const up = await fetch(`${running.url}/api/health`).then((r) => r.ok, () => false);
        if (up) break;
        if (i === 149) throw new Error('The app did not start within 30 s');
        await new Promise((r) => setTimeout(r, 200));
      }
      const login = await fetch(`${running.url}/api/auth/login`, {
        method: 'POST', headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ email: demoAccounts[1]!.email, password: DEMO_PASSWORD }),
      });
      const cookie = (login.headers.get('set-cookie') ?? '').split(';')[0]!;
      const headers = { 'content-type': 'application/json', cookie };
      const cachedBody = JSON.stringify({
        frame: { azimuthDeg: 150, halfWidthDeg: 20, bottomAltDeg: 3, topAltDeg: 25 },
        vantage: { lat: 50.58, lon: -4.91, elevationM: 5 },
        target: { id: 'galactic-centre' }, from: '2027-01-01', to: '2027-12-31',
      });
      // Warm the dark-window cache for the cached search.
      await fetch(`${running.url}/api/lineups/search`, { method: 'POST', headers, body: cachedBody });

      // Long searches beside the load: 10 years each, at sites never seen (nothing cached).
      let stop = false;
      const longTimes: number[] = [];
      const longLoop = (async () => {
        for (let i = 0; !stop && i < 200; i += 1) {
          const t0 = performance.now();
          await fetch(`${running.url}/api/lineups/search`, {
            method: 'POST', headers,
            body: JSON.stringify({
              frame: { azimuthDeg: 180, halfWidthDeg: 30, bottomAltDeg: 2, topAltDeg: 30 },
              vantage: { lat: 40 + (i % 20) * 0.37, lon: -10 + i * 0.29, elevationM: 0 },
              target: { id: 'm42' }, from: '2027-01-01', to: '2036-12-31',
            }),
          });
          longTimes.push(performance.now() - t0);
        }
      })();

      const result = await autocannon({
        url: `${running.url}/api/lineups/search`, method: 'POST', headers, body: cachedBody,
        connections: CONNECTIONS, duration: LOAD_SECONDS,
      });
      stop = true;
      await longLoop;
      longTimes.sort((a, b) => a - b);
      const figures: ApiLoadFigures = {
        requestsPerSecond: result.requests.average,
        p50Ms: result.latency.p50,
        p99Ms: result.latency.p99,
        errors: result.errors + result.non2xx,
        longSearchesDone: longTimes.length,
        longSearchMedianMs: longTimes[Math.floor(longTimes.length / 2)] ?? NaN,
      };
      log(`API load: cached 1-year search, ${CONNECTIONS} connections for ${LOAD_SECONDS} s, with 10-year uncached searches running beside it`);
      log(`  throughput          ${figures.requestsPerSecond.toFixed(0)} req/s`);
      log(`  latency p50 / p99   ${figures.p50Ms} ms / ${figures.p99Ms} ms   (goal: p99 < 50 ms)`);
      log(`  errors / non-2xx    ${figures.errors}`);
      log(`  long searches done  ${figures.longSearchesDone}, median ${figures.longSearchMedianMs.toFixed(0)} ms each`);
      return figures;
    } finally {
      server.kill('SIGTERM');
      await new Promise((r) => server.once('exit', r));
    }
  } finally {
    await pg.stop();
    rmSync(root, { recursive: true, force: true });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) await runApiLoadBench();
