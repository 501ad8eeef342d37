/**
 * Apparent place of fixed J2000 targets: precession, nutation (astronomy-engine's
 * `Rotation_EQJ_EQD`) and annual aberration (first order, from the Earth's heliocentric velocity
 * `HelioState(Body.Earth)`, as astronomy-engine applies it to a star defined with `DefineStar`),
 * with no stellar parallax (targets are at infinity). Diurnal aberration (under 0.32 arcsec) is
 * left out, as in astronomy-engine.
 *
 * The place is computed exactly at nodes at most 15 days apart (shared by every target of a
 * search) and interpolated linearly in between: the error, from the 13.7-day nutation term and the
 * curvature of the annual aberration, stays below 0.7 arcsec (measured 0.63 over 2026-2036), which
 * moves a frame-edge crossing by a few hundredths of a second.
 */
import { Body, C_AUDAY, HelioState, MakeTime, RotateVector, Rotation_EQJ_EQD, Vector } from 'astronomy-engine';
import type { EquatorialJ2000 } from '../schemas/geometry';

/** Largest spacing of the exact apparent-place nodes, days. */
export const PLACE_NODE_MAX_SPACING_DAYS = 15;

/** Node times with the target-independent parts of the apparent place. */
export interface PlaceNodes {
  /** First node time, UT days since J2000. */
  start: number;
  /** Spacing of the nodes, days. */
  spacing: number;
  /** Number of nodes (>= 2). */
  count: number;
  /** Earth's heliocentric velocity over c at each node (EQJ), 3 per node. */
  beta: Float64Array;
  /** EQJ->EQD rotation at each node, 9 per node (astronomy-engine's `rot` layout). */
  rotation: Float64Array;
}

/**
 * Nodes covering [from - 1, to + 1] day.
 * @param from - Start, UT days; @param to - End, UT days (> from).
 */
export function placeNodes(from: number, to: number): PlaceNodes {
  const a = from - 1;
  const b = to + 1;
  const count = Math.max(2, Math.ceil((b - a) / PLACE_NODE_MAX_SPACING_DAYS) + 1);
  const spacing = (b - a) / (count - 1);
  const beta = new Float64Array(3 * count);
  const rotation = new Float64Array(9 * count);
  for (let j = 0; j < count; j++) {
    const time = MakeTime(a + j * spacing);
    const earth = HelioState(Body.Earth, time);
    beta[3 * j] = earth.vx / C_AUDAY;
    beta[3 * j + 1] = earth.vy / C_AUDAY;
    beta[3 * j + 2] = earth.vz / C_AUDAY;
    const rot = Rotation_EQJ_EQD(time).rot;
    for (let r = 0; r < 3; r++) for (let c = 0; c < 3; c++) rotation[9 * j + 3 * r + c] = rot[r]![c]!;
  }
  return { start: a, spacing, count, beta, rotation };
}

/**
 * Unit vector of a J2000 RA/Dec.
 * @param target - RA 0..24 h, Dec -90..90 deg.
 * @returns [x, y, z] in EQJ.
 */
export function j2000UnitVector(target: EquatorialJ2000): [number, number, number] {
  const ra = (target.raHours * Math.PI) / 12;
  const dec = (target.decDeg * Math.PI) / 180;
  return [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
}

/** A target's apparent direction (EQD unit vector) at every node, 3 per node. */
export function targetNodeDirections(nodes: PlaceNodes, target: EquatorialJ2000): Float64Array {
  const [ux, uy, uz] = j2000UnitVector(target);
  const out = new Float64Array(3 * nodes.count);
  for (let j = 0; j < nodes.count; j++) {
    let x = ux + nodes.beta[3 * j]!;
    let y = uy + nodes.beta[3 * j + 1]!;
    let z = uz + nodes.beta[3 * j + 2]!;
    const n = Math.hypot(x, y, z);
    x /= n;
    y /= n;
    z /= n;
    // Same product as astronomy-engine's RotateVector: v'[i] = sum_k rot[k][i] v[k].
    const r = nodes.rotation;
    const o = 9 * j;
    out[3 * j] = r[o]! * x + r[o + 3]! * y + r[o + 6]! * z;
    out[3 * j + 1] = r[o + 1]! * x + r[o + 4]! * y + r[o + 7]! * z;
    out[3 * j + 2] = r[o + 2]! * x + r[o + 5]! * y + r[o + 8]! * z;
  }
  return out;
}

/**
 * Interpolated apparent direction at time t.
 * @param nodes - The nodes; @param directions - From {@link targetNodeDirections}.
 * @param t - UT days, inside the nodes' span (clamped otherwise).
 * @param out - Receives the EQD unit vector.
 */
export function directionAt(nodes: PlaceNodes, directions: Float64Array, t: number, out: Float64Array): void {
  const u = (t - nodes.start) / nodes.spacing;
  let j = Math.floor(u);
  if (j < 0) j = 0;
  else if (j > nodes.count - 2) j = nodes.count - 2;
  const w = u - j;
  const o = 3 * j;
  const x = directions[o]! + w * (directions[o + 3]! - directions[o]!);
  const y = directions[o + 1]! + w * (directions[o + 4]! - directions[o + 1]!);
  const z = directions[o + 2]! + w * (directions[o + 5]! - directions[o + 2]!);
  const n = Math.sqrt(x * x + y * y + z * z);
  out[0] = x / n;
  out[1] = y / n;
  out[2] = z / n;
}

/**
 * Exact apparent direction (EQD unit vector) of a J2000 target at one instant, through the same
 * definition as the nodes. Used for checks and single evaluations.
 * @param target - RA/Dec J2000; @param t - UT days since J2000.
 */
export function exactDirection(target: EquatorialJ2000, t: number): [number, number, number] {
  const time = MakeTime(t);
  const [ux, uy, uz] = j2000UnitVector(target);
  const earth = HelioState(Body.Earth, time);
  const x = ux + earth.vx / C_AUDAY;
  const y = uy + earth.vy / C_AUDAY;
  const z = uz + earth.vz / C_AUDAY;
  const n = Math.hypot(x, y, z);
  const v = RotateVector(Rotation_EQJ_EQD(time), new Vector(x / n, y / n, z / n, time));
  return [v.x, v.y, v.z];
}
