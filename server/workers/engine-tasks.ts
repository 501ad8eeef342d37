/** The CPU-heavy engine calls the server runs, as plain-data tasks (the same in a worker or inline). */
import { computeDarkWindows, searchLineups, type DarkWindowSet, type Lineup, type MoonCondition } from '../../shared/lineup';
import type { EquatorialJ2000, Frame, ObserverSite } from '../../shared/schemas/geometry';

export type EngineTask =
  | { kind: 'darkWindows'; site: ObserverSite; year: number; conditions: { sunMaxAltDeg: number; moon: MoonCondition } }
  | {
      kind: 'search'; frame: Frame; site: ObserverSite; target: EquatorialJ2000; from: Date; to: Date;
      conditions: { sunMaxAltDeg: number; moon: MoonCondition; minDurationMin: number }; darkWindows: DarkWindowSet[];
    };

export type EngineResult<T extends EngineTask> = T extends { kind: 'darkWindows' } ? DarkWindowSet : Lineup[];

/** Runs one task. Throws RangeError on input the engine refuses. */
export function runEngineTask<T extends EngineTask>(task: T): EngineResult<T> {
  if (task.kind === 'darkWindows') {
    const { site, year, conditions } = task;
    return computeDarkWindows(site, new Date(Date.UTC(year, 0, 1)), new Date(Date.UTC(year + 1, 0, 1)), conditions) as EngineResult<T>;
  }
  return searchLineups(task.frame, task.site, task.target, task.from, task.to, task.conditions, { darkWindows: task.darkWindows }) as EngineResult<T>;
}
