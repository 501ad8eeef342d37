/**
 * Fast Sun and Moon values for one site from the fitted tables (for charts that need many points).
 * Same definitions as the search (siteSky.ts).
 */
import type { ObserverSite } from '../schemas/geometry';
import { SiteSky } from './siteSky';
import { checkedUnixMs, unixMsToUtDays } from './time';

/** Sun and Moon at one site. Every method takes a UTC Date within 1900..2200 and throws RangeError otherwise. */
export interface SkyAtSite {
  /** Sun centre geometric topocentric altitude, deg. */
  sunAltitudeDeg(date: Date): number;
  /** Moon centre geometric topocentric altitude, deg. */
  moonAltitudeDeg(date: Date): number;
  /** Moon illuminated fraction, 0..1. */
  moonIllumination(date: Date): number;
  /** True when the Moon's refracted upper limb is below the horizon. */
  moonIsDown(date: Date): boolean;
}

/**
 * Creates the fast evaluators for a site.
 * @param site - Latitude -90..90 deg, longitude -180..180 deg, elevation -500..9000 m.
 * @throws RangeError on an invalid site.
 */
export function createSkyAtSite(site: ObserverSite): SkyAtSite {
  const sky = new SiteSky(site);
  const ut = (d: Date): number => unixMsToUtDays(checkedUnixMs(d, 'date'));
  return {
    sunAltitudeDeg: (d) => sky.sunAltitudeDeg(ut(d)),
    moonAltitudeDeg: (d) => sky.moonAltitudeDeg(ut(d)),
    moonIllumination: (d) => sky.moonIlluminatedFraction(ut(d)),
    moonIsDown: (d) => sky.moonLimbSin(ut(d)) < 0,
  };
}
