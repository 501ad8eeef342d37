import { frameFromSightline } from '../../shared/geo';
import type { Frame, ObserverSite } from '../../shared/schemas/geometry';
import type { Lineup, LineupSearchRequest, LineupSearchResponse, TargetRef } from '../../shared/schemas/lineup';
import { checkedRange } from '../../shared/lineup/time';
import { findTarget } from '../../shared/sky/catalogue';
import { timeZoneForSite } from '../../shared/sky/timezone';
import { lineupTideStatusFromAccess, tideAccess, type TideAccess } from '../../shared/tide';
import { AppError } from '../errors';
import type { UserModel } from '../models/user';
import type { DarkWindowCache } from './dark-window-cache';
import type { SightlineService } from './sightline-service';
import type { TideService } from './tide-service';
import type { EnginePool } from '../workers/engine-pool';
import { runEngineTask, type EngineTask } from '../workers/engine-tasks';

const DAY_MS = 86_400_000;
/** Searches up to this long run inline (a few ms with cached dark windows); longer ones go to the pool. */
const INLINE_SEARCH_MAX_DAYS = 400;
/** Serialized search answers kept in memory for repeated identical searches. */
const RESULT_CACHE_ENTRIES = 300;

export interface ResolvedTarget { id?: string; name: string; raHours: number; decDeg: number }

/** A catalogue target by id (400 on an unknown id) or a custom J2000 position, with its name. */
export function resolveTarget(ref: TargetRef): ResolvedTarget {
  if ('id' in ref) {
    const t = findTarget(ref.id);
    if (!t) throw new AppError('validation', 'Unknown target', { 'target.id': 'Unknown target id' });
    return { id: t.id, name: t.name, raHours: t.raHours, decDeg: t.decDeg };
  }
  return { name: ref.name, raHours: ref.raHours, decDeg: ref.decDeg };
}

/** The lineup search use case: geometry from the request or a saved sightline, cached dark windows, tide status. */
export class LineupService {
  constructor(
    private readonly darkWindows: DarkWindowCache,
    private readonly sightlines: SightlineService,
    private readonly tides: TideService,
    private readonly pool: EnginePool,
  ) {}

  /** Serialized answers (without computeMs) by request, so a repeated search costs no engine work nor JSON encoding. */
  private readonly results = new Map<string, string>();

  private remember(key: string, body: string): void {
    if (this.results.size >= RESULT_CACHE_ENTRIES) this.results.delete(this.results.keys().next().value!);
    this.results.set(key, body);
  }

  /**
   * The search answer as a JSON string, from the in-memory cache for a repeated identical search
   * (searches on saved sightlines are not cached: their tide data may change).
   */
  async searchAsJson(user: UserModel, request: LineupSearchRequest): Promise<string> {
    const started = performance.now();
    const key = request.sightlineId ? undefined : JSON.stringify(request);
    const hit = key ? this.results.get(key) : undefined;
    const withComputeMs = (body: string, ms: number) => `${body.slice(0, -1)},"computeMs":${ms}}`;
    if (hit) return withComputeMs(hit, Math.round((performance.now() - started) * 10) / 10);
    const { computeMs, ...rest } = await this.search(user, request);
    const body = JSON.stringify(rest);
    if (key) this.remember(key, body);
    return withComputeMs(body, computeMs);
  }

  /**
   * The next good lineups of a saved sightline over the coming year: the first `count` with a
   * score of at least `minScore` (default 0.3: centred enough, dark enough, long enough to be
   * worth the drive), from now on.
   */
  async nextLineups(user: UserModel, sightlineId: string, options: { targetId?: string; count?: number; minScore?: number; now?: Date } = {}): Promise<LineupSearchResponse> {
    const sightline = await this.sightlines.get(user, sightlineId, 'read');
    const now = options.now ?? new Date();
    // Whole hours, so that repeated calls within the hour share cached dark windows and results.
    const from = new Date(Math.floor(now.getTime() / 3600_000) * 3600_000);
    const result = await this.search(user, {
      sightlineId,
      target: { id: options.targetId ?? sightline.targetId },
      from,
      to: new Date(from.getTime() + 365 * DAY_MS),
      conditions: { sunMaxAltDeg: -18, moon: 'down', minDurationMin: 5 },
    });
    const good = result.lineups.filter((l) => l.score >= (options.minScore ?? 0.3) && Date.parse(l.end) > now.getTime());
    return { ...result, lineups: good.slice(0, options.count ?? 3) };
  }

  async search(user: UserModel, request: LineupSearchRequest): Promise<LineupSearchResponse> {
    const started = performance.now();
    const saved = request.sightlineId ? (await this.sightlines.get(user, request.sightlineId, 'read')).toPublic() : undefined;
    const geometry = request.sightline ?? (saved && !request.frame ? { vantage: saved.vantage, landmark: saved.landmark, bandHeightDeg: saved.bandHeightDeg } : undefined);

    let frame: Frame;
    let site: ObserverSite;
    if (request.frame) {
      frame = request.frame;
      const v = request.vantage ?? (saved ? { lat: saved.vantage.lat, lon: saved.vantage.lon, elevationM: saved.vantage.elevationM + saved.vantage.cameraHeightM } : undefined);
      if (!v) throw new AppError('validation', 'A typed frame needs the vantage position', { vantage: 'Give the vantage position' });
      site = v;
    } else if (geometry) {
      try {
        frame = frameFromSightline(geometry.vantage, geometry.landmark, { bandHeightDeg: geometry.bandHeightDeg });
      } catch (error) {
        // Pins that coincide or lie too far apart give no frame (a saved sightline can hold such pins too).
        if (error instanceof RangeError) throw new AppError('validation', error.message, { [request.sightline ? 'sightline' : 'sightlineId']: error.message });
        throw error;
      }
      site = { lat: geometry.vantage.lat, lon: geometry.vantage.lon, elevationM: geometry.vantage.elevationM + geometry.vantage.cameraHeightM };
    } else {
      throw new AppError('validation', 'Give a frame or a sightline', { frame: 'Give a frame or a sightline' });
    }

    const target = resolveTarget(request.target);
    const { conditions } = request;
    let found;
    try {
      // Before the cache: it keys rows by UTC year, and a year outside the engine span must not reach it.
      checkedRange(request.from, request.to);
      const sets = await this.darkWindows.setsFor(site, request.from, request.to, conditions);
      const task: EngineTask = { kind: 'search', frame, site, target: { raHours: target.raHours, decDeg: target.decDeg }, from: request.from, to: request.to, conditions, darkWindows: sets };
      const inline = request.to.getTime() - request.from.getTime() <= INLINE_SEARCH_MAX_DAYS * DAY_MS;
      found = inline ? runEngineTask(task) : await this.pool.run(task);
    } catch (error) {
      if (error instanceof RangeError) throw new AppError('validation', error.message);
      throw error;
    }

    let access: TideAccess | undefined;
    if (saved?.tideRule) {
      const events = await this.tides.eventsUnchecked(saved.id, { from: new Date(request.from.getTime() - DAY_MS), to: new Date(request.to.getTime() + DAY_MS) });
      access = tideAccess(saved.tideRule, events);
    }

    const lineups: Lineup[] = found.map((l) => {
      const tide = access ? lineupTideStatusFromAccess(access, l.start, l.end) : undefined;
      return {
        start: l.start.toISOString(),
        end: l.end.toISOString(),
        peak: l.peak.toISOString(),
        durationMin: l.durationMin,
        peakAzimuthDeg: l.peakAzimuthDeg,
        peakAltitudeDeg: l.peakAltitudeDeg,
        sunAltitudeDeg: l.sunAltitudeDeg,
        moonAltitudeDeg: l.moonAltitudeDeg,
        moonIllumination: l.moonIllumination,
        score: l.score,
        ...(tide ? { tideStatus: tide.status, tideCutOffAt: tide.cutOffAt?.toISOString() ?? null } : {}),
      };
    });
    const response: LineupSearchResponse = {
      lineups,
      timezone: saved?.timezone ?? timeZoneForSite(site.lat, site.lon),
      target,
      frame,
      computeMs: Math.round((performance.now() - started) * 10) / 10,
    };
    return response;
  }
}
