/**
 * Input guards shared by the geometry modules: every public function checks its numbers with
 * these and throws a RangeError that names the argument, its unit and its valid range.
 */
import type { z } from 'zod';

/**
 * Throws a RangeError unless `value` is a finite number within `[min, max]`.
 *
 * @param name - argument name with its unit, used in the message (e.g. `'distanceM'`)
 * @param value - the value to check
 * @param min - smallest allowed value (inclusive)
 * @param max - largest allowed value (inclusive)
 * @returns the value, for chaining
 */
export function assertInRange(name: string, value: number, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${String(value)}`);
  }
  if (value < min || value > max) {
    throw new RangeError(`${name} must be between ${min} and ${max}, got ${value}`);
  }
  return value;
}

/**
 * Throws a RangeError unless `value` is a finite number with `0 < value <= max`.
 *
 * @param name - argument name with its unit, used in the message
 * @param value - the value to check
 * @param max - largest allowed value (inclusive)
 * @returns the value, for chaining
 */
export function assertPositiveUpTo(name: string, value: number, max: number): number {
  assertInRange(name, value, 0, max);
  if (value === 0) {
    throw new RangeError(`${name} must be above 0 and at most ${max}, got 0`);
  }
  return value;
}

/**
 * Parses `value` with a zod schema and throws a RangeError listing the problems when it does
 * not fit (NaN, out-of-range latitude, missing field ...). Defaults in the schema are applied.
 *
 * @param name - what the value is (e.g. `'vantage'`), used in the message
 * @param schema - the zod schema from shared/schemas
 * @param value - the value to check
 * @returns the parsed value
 */
export function parseOrThrow<S extends z.ZodType>(name: string, schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const problems = result.error.issues
      .map((issue) => `${issue.path.length > 0 ? issue.path.join('.') + ': ' : ''}${issue.message}`)
      .join('; ');
    throw new RangeError(`Invalid ${name}: ${problems}`);
  }
  return result.data;
}

/**
 * Normalises an angle in degrees to `[0, 360)`.
 *
 * @param angleDeg - any finite angle in degrees
 * @returns the same direction in `[0, 360)` degrees
 */
export function normalizeDegrees360(angleDeg: number): number {
  const wrapped = angleDeg % 360;
  const positive = wrapped < 0 ? wrapped + 360 : wrapped;
  // -1e-15 % 360 + 360 rounds to 360 exactly: fold it back to 0.
  return positive >= 360 ? 0 : positive;
}

/**
 * Signed smallest difference `a - b` between two directions, in `(-180, 180]` degrees.
 *
 * @param aDeg - first direction in degrees
 * @param bDeg - second direction in degrees
 * @returns `a - b` folded to `(-180, 180]` degrees
 */
export function angleDifferenceDeg(aDeg: number, bDeg: number): number {
  const d = normalizeDegrees360(aDeg - bDeg);
  return d > 180 ? d - 360 : d;
}
