/**
 * Galactic coordinates <-> J2000 equatorial (ICRS), with the IAU galactic frame as astropy defines
 * it: north galactic pole at RA 192.8594812065348 deg, Dec +27.12825118085622 deg, and galactic
 * longitude of the north celestial pole 122.9319185680026 deg.
 *
 * Own code (a two-line spherical rotation) because astronomy-engine has no galactic frame.
 *
 * "The galactic centre" here is the origin of galactic coordinates, l = 0, b = 0 (RA 17h45m37.20s,
 * Dec -28d56m10.2s J2000). The radio source Sgr A* (the black hole) is 4.4 arcmin away; its
 * position is exported too for reference.
 */
import type { EquatorialJ2000 } from '../schemas/geometry';
import { assertFiniteInRange } from '../guards';
import { DEG_PER_RAD, normalizeDegrees360, RAD_PER_DEG } from '../units';
import { assertEquatorialJ2000 } from './guards';

/** RA of the north galactic pole (J2000/ICRS), degrees (astropy Galactic frame). */
export const NORTH_GALACTIC_POLE_RA_DEG = 192.8594812065348;
/** Dec of the north galactic pole (J2000/ICRS), degrees (astropy Galactic frame). */
export const NORTH_GALACTIC_POLE_DEC_DEG = 27.12825118085622;
/** Galactic longitude of the north celestial pole, degrees (astropy Galactic frame). */
export const NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG = 122.9319185680026;

/** Galactic coordinates, degrees: longitude 0 <= l < 360, latitude -90..90. */
export interface Galactic {
  lDeg: number;
  bDeg: number;
}

const SIN_DEC_GP = Math.sin(NORTH_GALACTIC_POLE_DEC_DEG * RAD_PER_DEG);
const COS_DEC_GP = Math.cos(NORTH_GALACTIC_POLE_DEC_DEG * RAD_PER_DEG);

/**
 * Galactic coordinates of a J2000 position.
 * @param position RA 0..24 h, Dec -90..90 deg (J2000/ICRS)
 * @returns l (0..360 deg) and b (-90..90 deg)
 * @throws RangeError on invalid input
 */
export function equatorialJ2000ToGalactic(position: EquatorialJ2000): Galactic {
  const p = assertEquatorialJ2000(position, 'position');
  const ra = p.raHours * 15 * RAD_PER_DEG;
  const dec = p.decDeg * RAD_PER_DEG;
  const dRa = ra - NORTH_GALACTIC_POLE_RA_DEG * RAD_PER_DEG;
  const sinB = Math.sin(dec) * SIN_DEC_GP + Math.cos(dec) * COS_DEC_GP * Math.cos(dRa);
  const y = Math.cos(dec) * Math.sin(dRa);
  const x = Math.sin(dec) * COS_DEC_GP - Math.cos(dec) * SIN_DEC_GP * Math.cos(dRa);
  const l = NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG - Math.atan2(y, x) * DEG_PER_RAD;
  return { lDeg: normalizeDegrees360(l), bDeg: Math.asin(Math.max(-1, Math.min(1, sinB))) * DEG_PER_RAD };
}

/**
 * J2000 position of galactic coordinates.
 * @param lDeg galactic longitude, degrees, any finite value (wrapped)
 * @param bDeg galactic latitude, degrees, -90..90
 * @returns RA 0 <= ra < 24 h, Dec -90..90 deg (J2000/ICRS)
 * @throws RangeError on invalid input
 */
export function galacticToEquatorialJ2000(lDeg: number, bDeg: number): EquatorialJ2000 {
  assertFiniteInRange(lDeg, 'lDeg');
  assertFiniteInRange(bDeg, 'bDeg', -90, 90);
  const b = bDeg * RAD_PER_DEG;
  const dl = (NORTH_CELESTIAL_POLE_GALACTIC_LON_DEG - lDeg) * RAD_PER_DEG;
  const sinDec = Math.sin(b) * SIN_DEC_GP + Math.cos(b) * COS_DEC_GP * Math.cos(dl);
  const y = Math.cos(b) * Math.sin(dl);
  const x = Math.sin(b) * COS_DEC_GP - Math.cos(b) * SIN_DEC_GP * Math.cos(dl);
  const raDeg = normalizeDegrees360(NORTH_GALACTIC_POLE_RA_DEG + Math.atan2(y, x) * DEG_PER_RAD);
  const raHours = raDeg / 15;
  return { raHours: raHours >= 24 ? 0 : raHours, decDeg: Math.asin(Math.max(-1, Math.min(1, sinDec))) * DEG_PER_RAD };
}

/** The galactic centre used by Gnomon: galactic l = 0, b = 0, in J2000 (RA ~17h45m37.2s, Dec ~-28d56m10s). */
export const GALACTIC_CENTRE_J2000: EquatorialJ2000 = galacticToEquatorialJ2000(0, 0);

/** The radio source Sgr A*, J2000: RA 17h45m40.04s, Dec -29d00m28.1s (published position). */
export const SGR_A_STAR_J2000: EquatorialJ2000 = {
  raHours: 17 + 45 / 60 + 40.04 / 3600,
  decDeg: -(29 + 0 / 60 + 28.1 / 3600),
};

/** A point of the galactic plane. */
export interface GalacticPlanePoint extends EquatorialJ2000 {
  /** Galactic longitude, degrees. */
  lDeg: number;
}

/**
 * Points along the galactic plane (b = 0) in J2000, for a sky overlay.
 * @param stepDeg spacing in galactic longitude, degrees, 0.1..90 (default 2)
 * @returns points from l = 0 up to (not including) 360, in longitude order
 * @throws RangeError on invalid input
 */
export function galacticPlanePoints(stepDeg = 2): GalacticPlanePoint[] {
  assertFiniteInRange(stepDeg, 'stepDeg', 0.1, 90);
  const out: GalacticPlanePoint[] = [];
  for (let i = 0; i * stepDeg < 360 - 1e-9; i++) {
    const lDeg = i * stepDeg;
    out.push({ lDeg, ...galacticToEquatorialJ2000(lDeg, 0) });
  }
  return out;
}
