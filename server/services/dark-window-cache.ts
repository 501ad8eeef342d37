import type { DarkWindowSet, MoonCondition } from '../../shared/lineup';
import type { ObserverSite } from '../../shared/schemas/geometry';
import { DarkWindowCacheModel } from '../models/dark-window-cache';
import type { EnginePool } from '../workers/engine-pool';

/** Bump when the engine's dark windows change, so old cached rows are no longer used. */
export const DARK_WINDOW_ENGINE_VERSION = 1;
/** Sites are cached on a 0.01 deg grid (about 1 km): the windows move by seconds across a cell. */
const SITE_GRID_DEG = 0.01;
/** Site-years kept in memory, on top of PostgreSQL. */
const MEMORY_ENTRIES = 500;

export interface SkyConditionsKey {
  sunMaxAltDeg: number;
  moon: MoonCondition;
}

/** The grid point a site's dark windows are computed and cached for. */
export function cachedSite(site: ObserverSite): ObserverSite {
  const round = (v: number) => Math.round(v / SITE_GRID_DEG) * SITE_GRID_DEG;
  return { lat: Number(round(site.lat).toFixed(2)), lon: Number(round(site.lon).toFixed(2)), elevationM: 0 };
}

function conditionsKey(c: SkyConditionsKey): string {
  return `sun${c.sunMaxAltDeg}|moon:${c.moon === 'down' ? 'down' : `max${c.moon.maxIllumination}`}`;
}

/**
 * Dark windows per site and UTC calendar year, computed once and kept in PostgreSQL (and a small
 * in-memory map), so repeated searches at a site skip the Sun and Moon work.
 */
export class DarkWindowCache {
  private readonly memory = new Map<string, DarkWindowSet>();

  /** @param pool - Where uncached years are computed, off the event loop. */
  constructor(private readonly pool: EnginePool) {}

  /** The sets covering [from, to], one per UTC year, computed and stored where missing. */
  async setsFor(site: ObserverSite, from: Date, to: Date, conditions: SkyConditionsKey): Promise<DarkWindowSet[]> {
    const grid = cachedSite(site);
    const sets: DarkWindowSet[] = [];
    for (let year = from.getUTCFullYear(); year <= to.getUTCFullYear(); year += 1) {
      sets.push(await this.yearSet(grid, year, conditions));
    }
    return sets;
  }

  private async yearSet(grid: ObserverSite, year: number, conditions: SkyConditionsKey): Promise<DarkWindowSet> {
    const siteKey = `${grid.lat.toFixed(2)},${grid.lon.toFixed(2)}`;
    const cKey = conditionsKey(conditions);
    const memoryKey = `${siteKey}|${year}|${cKey}`;
    const remembered = this.memory.get(memoryKey);
    if (remembered) return remembered;

    const where = { siteKey, year, conditionsKey: cKey, engineVersion: DARK_WINDOW_ENGINE_VERSION };
    const row = await DarkWindowCacheModel.findOne({ where });
    let set = row?.windowSet;
    if (!set) {
      set = await this.pool.run({ kind: 'darkWindows', site: grid, year, conditions: { sunMaxAltDeg: conditions.sunMaxAltDeg, moon: conditions.moon } });
      // Two requests may compute the same year at once: the unique key keeps one row.
      await DarkWindowCacheModel.bulkCreate([{ ...where, windowSet: set }], { ignoreDuplicates: true });
    }
    if (this.memory.size >= MEMORY_ENTRIES) this.memory.delete(this.memory.keys().next().value!);
    this.memory.set(memoryKey, set);
    return set;
  }
}
