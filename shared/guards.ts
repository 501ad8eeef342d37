/**
 * Input guards shared by the geometry, sky, lineup and tide modules. Each throws a RangeError
 * that names the argument (with its unit where the name carries one), the valid range and the
 * value received, so every public function answers bad input with one error type and one wording:
 *
 * - `<name> must be a finite number (got <value>)`
 * - `<name> must be between <min> and <max> (got <value>)`
 * - `<name> must be above 0 and at most <max> (got <value>)`
 * - `<name> must be an integer between <min> and <max> (got <value>)`
 * - `<name> must be a valid Date`
 * - `Invalid <name>: <path>: <problem>; ...` (a zod schema's issues)
 */
import type { z } from 'zod';

/**
 * Checks that `value` is a finite number within `[min, max]` (inclusive) and returns it.
 *
 * @param value - the value to check
 * @param name - the argument's name (with its unit), used in the message, e.g. `'distanceM'`
 * @param min - smallest allowed value, inclusive (default -Infinity: any finite number)
 * @param max - largest allowed value, inclusive (default +Infinity)
 * @returns the value, for chaining
 * @throws RangeError when `value` is not a finite number in range
 */
export function assertFiniteInRange(value: unknown, name: string, min = -Infinity, max = Infinity): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number (got ${String(value)})`);
  }
  if (value < min || value > max) {
    throw new RangeError(`${name} must be between ${min} and ${max} (got ${value})`);
  }
  return value;
}

/**
 * Checks that `value` is a finite number with `0 < value <= max` and returns it.
 *
 * @param value - the value to check
 * @param name - the argument's name (with its unit), used in the message
 * @param max - largest allowed value, inclusive (> 0)
 * @returns the value, for chaining
 * @throws RangeError when `value` is not a finite number in `(0, max]`
 */
export function assertPositiveUpTo(value: unknown, name: string, max: number): number {
  const v = assertFiniteInRange(value, name);
  if (!(v > 0 && v <= max)) {
    throw new RangeError(`${name} must be above 0 and at most ${max} (got ${v})`);
  }
  return v;
}

/**
 * Checks that `value` is an integer within `[min, max]` (inclusive) and returns it.
 *
 * @param value - the value to check
 * @param name - the argument's name, used in the message
 * @param min - smallest allowed integer, inclusive
 * @param max - largest allowed integer, inclusive
 * @returns the value, for chaining
 * @throws RangeError when `value` is not an integer in range (NaN and non-numbers included)
 */
export function assertIntegerInRange(value: unknown, name: string, min: number, max: number): number {
  if (typeof value !== 'number' || !Number.isInteger(value) || value < min || value > max) {
    throw new RangeError(`${name} must be an integer between ${min} and ${max} (got ${String(value)})`);
  }
  return value;
}

/**
 * Checks that `value` is a Date holding a real instant (not an Invalid Date) and returns it.
 *
 * @param value - the value to check
 * @param name - the argument's name, used in the message
 * @returns the same Date
 * @throws RangeError when `value` is not a Date or its time is NaN
 */
export function assertValidDate(value: unknown, name: string): Date {
  if (!(value instanceof Date) || !Number.isFinite(value.getTime())) {
    throw new RangeError(`${name} must be a valid Date`);
  }
  return value;
}

/**
 * Parses `value` with a zod schema and throws a RangeError listing the problems when it does
 * not fit (NaN, out-of-range latitude, missing field ...). Defaults in the schema are applied.
 *
 * @param name - what the value is (e.g. `'vantage'`, `'tide rule'`), used in the message
 * @param schema - the zod schema (from shared/schemas or a module's own)
 * @param value - the value to check
 * @returns the parsed value
 * @throws RangeError `Invalid <name>: <path>: <problem>; ...` when the value does not fit
 */
export function parseOrThrow<S extends z.ZodType>(name: string, schema: S, value: unknown): z.output<S> {
  const result = schema.safeParse(value);
  if (!result.success) {
    const problems = result.error.issues
      .map((issue) => `${issue.path.length > 0 ? issue.path.map(String).join('.') + ': ' : ''}${issue.message}`)
      .join('; ');
    throw new RangeError(`Invalid ${name}: ${problems}`);
  }
  return result.data;
}
