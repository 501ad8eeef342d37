/**
 * One-dimensional solvers used by the event searches: a bracketed root (secant steps from a
 * guess, safeguarded by bisection, or the Illinois variant of regula falsi) and an extremum by
 * Newton's method on central differences, safeguarded by a bracket on the derivative's sign.
 * Own code: each is a few dozen lines, and the event search needs what generic npm solvers do not
 * offer (an extremum search that stops early once the sign of the extreme value is certain, a root
 * search seeded with a model guess and slope).
 *
 * Not merged with sky/crossings.ts either: that module scans a function it knows nothing about
 * (sampling, golden-section extrema, bisection, a check on exact values either side of each
 * crossing) for the night report and the charts; these are the engine's fast solvers for one
 * bracket at a time, where the bracket and a first guess come from the event search.
 */

/** Time tolerance for roots, days (about 0.01 s). */
export const ROOT_TOLERANCE_DAYS = 1e-7;

/**
 * Root of f in [a, b] where f(a) and f(b) have opposite signs (or one is zero), starting from a
 * guess and a slope estimate; secant steps, bisection whenever a step would leave the bracket.
 * @param f - Continuous function of time (days).
 * @param a - Bracket start; @param fa - f(a).
 * @param b - Bracket end, > a; @param fb - f(b).
 * @param guess - First trial point (clamped into the bracket); NaN to start at the secant point.
 * @param slope - Estimate of f' near the root (per day); NaN or 0 when unknown.
 * @param tolerance - Stop when the last step or the bracket is below this, days (> 0).
 * @returns A time within about `tolerance` of a sign change of f.
 */
export function solveBracketed(
  f: (t: number) => number,
  a: number,
  fa: number,
  b: number,
  fb: number,
  guess = Number.NaN,
  slope = Number.NaN,
  tolerance = ROOT_TOLERANCE_DAYS,
): number {
  if (fa === 0) return a;
  if (fb === 0) return b;
  const negAtA = fa < 0;
  let x0 = guess > a && guess < b ? guess : (a * fb - b * fa) / (fb - fa);
  if (!(x0 > a && x0 < b)) x0 = (a + b) / 2;
  let f0 = f(x0);
  if (f0 === 0) return x0;
  if ((f0 < 0) === negAtA) {
    a = x0;
    fa = f0;
  } else {
    b = x0;
    fb = f0;
  }
  // Second point: Newton with the slope estimate, else the secant of the bracket.
  let x1 = slope && Number.isFinite(slope) ? x0 - f0 / slope : (a * fb - b * fa) / (fb - fa);
  if (!(x1 > a && x1 < b)) x1 = (a * fb - b * fa) / (fb - fa);
  if (!(x1 > a && x1 < b)) x1 = (a + b) / 2;
  for (let i = 0; i < 100; i++) {
    const f1 = f(x1);
    if (f1 === 0) return x1;
    if ((f1 < 0) === negAtA) {
      a = x1;
      fa = f1;
    } else {
      b = x1;
      fb = f1;
    }
    if (Math.abs(x1 - x0) <= tolerance || b - a <= tolerance) return x1;
    let x2 = f1 !== f0 ? x1 - (f1 * (x1 - x0)) / (f1 - f0) : Number.NaN;
    // Secant steps that leave the bracket, or crawl, give way to bisection.
    if (!(x2 > a && x2 < b) || Math.abs(x2 - x1) > 0.5 * (b - a)) x2 = (a + b) / 2;
    x0 = x1;
    f0 = f1;
    x1 = x2;
  }
  return x1;
}

/** Step of the central differences used for derivatives, days (8.64 s). */
export const DIFFERENCE_STEP_DAYS = 1e-4;

/**
 * Derivative of f at t by central differences, per day.
 * @param f - Smooth function of time (days).
 * @param t - Time, days.
 */
export function centralDerivative(f: (t: number) => number, t: number): number {
  return (f(t + DIFFERENCE_STEP_DAYS) - f(t - DIFFERENCE_STEP_DAYS)) / (2 * DIFFERENCE_STEP_DAYS);
}

/** An extremum: its time (days) and the function's value there. */
export interface Extremum {
  t: number;
  value: number;
}

/**
 * Locates the extremum of f inside [lo, hi], where f' changes sign once.
 *
 * Newton's method on central differences. It stops early when the step is below 0.02 day and the
 * predicted extreme value is farther than `margin` from zero: for an altitude-like function (a
 * cosine of the hour angle near its extremum) the step then leaves an error of a few seconds in
 * time and far less than `margin` in value, so the sign of the extremum is certain. Otherwise it
 * iterates to 1e-6 day.
 * @param f - Smooth function of time (days); the sign of its extremum is what callers need.
 * @param lo - Bracket start (derivative sign `signLo` there).
 * @param hi - Bracket end, > lo.
 * @param signLo - +1 if f increases at lo (a maximum inside), -1 if it decreases (a minimum).
 * @param start - First guess inside [lo, hi].
 * @param margin - Early-stop distance of the extreme value from zero (f units, >= 0); Infinity
 *   disables the early stop.
 */
export function refineExtremum(f: (t: number) => number, lo: number, hi: number, signLo: number, start: number, margin = Infinity): Extremum {
  const h = DIFFERENCE_STEP_DAYS;
  let t = Math.min(Math.max(start, lo), hi);
  for (let i = 0; i < 60; i++) {
    const fm = f(t - h);
    const f0 = f(t);
    const fp = f(t + h);
    const d1 = (fp - fm) / (2 * h);
    const d2 = (fp - 2 * f0 + fm) / (h * h);
    if ((d1 > 0) === (signLo > 0)) lo = t;
    else hi = t;
    const goodCurvature = signLo > 0 ? d2 < 0 : d2 > 0;
    let next = goodCurvature ? t - d1 / d2 : Number.NaN;
    if (goodCurvature && next > lo && next < hi) {
      const step = Math.abs(next - t);
      const predicted = f0 - (d1 * d1) / (2 * d2);
      if (step < 0.02 && Math.abs(predicted) > margin) return { t: next, value: predicted };
      if (step < 1e-6) return { t: next, value: f(next) };
    } else {
      next = (lo + hi) / 2;
    }
    t = next;
    if (hi - lo < 1e-6) break;
  }
  return { t, value: f(t) };
}

/**
 * Minimum of f on [a, b] by Brent's method (golden sections with parabolic steps).
 * @param f - Function to minimise, unimodal on [a, b] for a guaranteed global answer.
 * @param a - Interval start; @param b - Interval end (>= a).
 * @param tolerance - Absolute tolerance on the abscissa (> 0).
 * @returns The abscissa of the minimum found.
 */
export function minimizeBrent(f: (x: number) => number, a: number, b: number, tolerance: number): number {
  if (!(b > a)) return a;
  const golden = 0.381966011250105;
  let x = a + golden * (b - a);
  let w = x;
  let v = x;
  let fx = f(x);
  let fw = fx;
  let fv = fx;
  let d = 0;
  let e = 0;
  for (let i = 0; i < 100; i++) {
    const m = (a + b) / 2;
    const tol1 = tolerance + 1e-12 * Math.abs(x);
    const tol2 = 2 * tol1;
    if (Math.abs(x - m) <= tol2 - (b - a) / 2) break;
    let useGolden = true;
    if (Math.abs(e) > tol1) {
      let r = (x - w) * (fx - fv);
      let q = (x - v) * (fx - fw);
      let p = (x - v) * q - (x - w) * r;
      q = 2 * (q - r);
      if (q > 0) p = -p;
      else q = -q;
      r = e;
      e = d;
      if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
        d = p / q;
        const u = x + d;
        if (u - a < tol2 || b - u < tol2) d = x < m ? tol1 : -tol1;
        useGolden = false;
      }
    }
    if (useGolden) {
      e = (x < m ? b : a) - x;
      d = golden * e;
    }
    const u = Math.abs(d) >= tol1 ? x + d : x + (d > 0 ? tol1 : -tol1);
    const fu = f(u);
    if (fu <= fx) {
      if (u < x) b = x;
      else a = x;
      v = w;
      fv = fw;
      w = x;
      fw = fx;
      x = u;
      fx = fu;
    } else {
      if (u < x) a = u;
      else b = u;
      if (fu <= fw || w === x) {
        v = w;
        fv = fw;
        w = u;
        fw = fu;
      } else if (fu <= fv || v === x || v === w) {
        v = u;
        fv = fu;
      }
    }
  }
  return x;
}
