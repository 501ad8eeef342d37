/**
 * Reading a coordinate pair that someone typed or pasted, and writing coordinates back.
 *
 * Accepted (latitude first unless hemisphere letters say otherwise):
 * - decimal degrees: `52.1234, -7.1234`, `52.1234 -7.1234`, `52.1234N 7.1234W`, `N52.1234 W7.1234`
 * - degrees, minutes, seconds: `52°07'24.2"N 7°07'24.2"W`, `52 07 24.2 N, 7 07 24.2 W`
 * - degrees and decimal minutes: `52 07.404 N, 7 07.404 W`, `52°07.404' -7°07.404'`
 * - typographic marks (′ ″ º, curly quotes, Unicode minus), "lat:"/"lon:" labels, brackets,
 *   lower-case hemisphere letters, and decimal commas when the whole input uses them
 *   (`52,1234 -7,1234`).
 * A value carries either a sign or a hemisphere letter (N/S for latitude, E/W for longitude).
 *
 * Written here because no maintained package in the project's stack parses this range of human
 * formats with error messages a user can act on; the grammar is small and fully tested.
 */
import { assertFiniteInRange } from '../guards';
import type { GeoPoint } from './geodesy';

/** Outcome of {@link parseCoordinates}: a point, or a message saying what is wrong. */
export type CoordinateParseResult =
  | { ok: true; lat: number; lon: number }
  | { ok: false; error: string };

type Unit = 0 | 1 | 2; // degrees, minutes, seconds
type Token =
  | { kind: 'number'; text: string; sign: '' | '+' | '-'; value: number }
  | { kind: 'mark'; unit: Unit }
  | { kind: 'hemisphere'; letter: 'N' | 'S' | 'E' | 'W' }
  | { kind: 'separator' };

const UNIT_NAMES = ['degrees', 'minutes', 'seconds'] as const;
const EXAMPLE = 'e.g. 52.1234, -7.1234 or 52°07\'24.2"N 7°07\'24.2"W';

class CoordinateError extends Error {}

function normalize(input: string): string {
  let s = input
    .replace(/[\u00a0\u2000-\u200b\u202f\u205f\u3000]/g, ' ')
    .replace(/[\u2212\u2013\u2014]/g, '-')
    .replace(/[\u2033\u201c\u201d\u02ba]|''|\u2032\u2032/g, '"')
    .replace(/[\u2032\u2019\u2018\u00b4`\u02b9]/g, "'")
    .replace(/[\u00ba\u02da\u1d52]/g, '°')
    .replace(/\b(?:latitude|longitude|lat|lng|long|lon)\b\s*[:=]?/gi, ' ')
    .replace(/[()[\]{}]/g, ' ')
    .trim()
    .toUpperCase();
  // Decimal commas: only when the input has no dot and at least two digit,digit groups (two values).
  if (!s.includes('.') && (s.match(/\d,\d/g) ?? []).length >= 2) {
    s = s.replace(/(\d),(\d)/g, '$1.$2');
  }
  return s;
}

function tokenize(s: string): Token[] {
  const tokens: Token[] = [];
  const pattern = /\s+|([+-]?)(\d+(?:\.\d*)?|\.\d+)|(°)|(')|(")|([NSEW])|([,;/])/y;
  let index = 0;
  while (index < s.length) {
    pattern.lastIndex = index;
    const m = pattern.exec(s);
    if (m === null) {
      throw new CoordinateError(`Unexpected "${s[index]}" at character ${index + 1}: use digits, signs, °, ', " and N/S/E/W (${EXAMPLE})`);
    }
    index = pattern.lastIndex;
    if (m[2] !== undefined) {
      tokens.push({ kind: 'number', text: m[2], sign: (m[1] ?? '') as '' | '+' | '-', value: Number(m[2]) });
    } else if (m[3] !== undefined) {
      tokens.push({ kind: 'mark', unit: 0 });
    } else if (m[4] !== undefined) {
      tokens.push({ kind: 'mark', unit: 1 });
    } else if (m[5] !== undefined) {
      tokens.push({ kind: 'mark', unit: 2 });
    } else if (m[6] !== undefined) {
      tokens.push({ kind: 'hemisphere', letter: m[6] as 'N' | 'S' | 'E' | 'W' });
    } else if (m[7] !== undefined) {
      tokens.push({ kind: 'separator' });
    }
  }
  return tokens;
}

/** Splits the tokens into the two values. */
function splitPair(tokens: Token[]): [Token[], Token[]] {
  const separators = tokens.flatMap((t, i) => (t.kind === 'separator' ? [i] : []));
  if (separators.length > 0) {
    const parts: Token[][] = [];
    let start = 0;
    for (const i of [...separators, tokens.length]) {
      parts.push(tokens.slice(start, i));
      start = i + 1;
    }
    const filled = parts.filter((p) => p.length > 0);
    if (filled.length !== 2) {
      throw new CoordinateError(`Expected two values, latitude and longitude, separated by one comma; found ${filled.length} (${EXAMPLE})`);
    }
    return [filled[0] as Token[], filled[1] as Token[]];
  }

  const hemispheres = tokens.flatMap((t, i) => (t.kind === 'hemisphere' ? [i] : []));
  const first = hemispheres[0];
  if (first !== undefined) {
    if (first === 0) {
      // Prefix letters: N52.1 W7.1 -> split before the second letter.
      const second = hemispheres[1];
      if (second !== undefined) return [tokens.slice(0, second), tokens.slice(second)];
    } else if (first < tokens.length - 1) {
      // Suffix letters: 52.1N 7.1W -> split after the first letter.
      return [tokens.slice(0, first + 1), tokens.slice(first + 1)];
    }
  }

  const numbers = tokens.flatMap((t, i) => (t.kind === 'number' ? [i] : []));
  const withDegreeMark = numbers.filter((i) => tokens[i + 1]?.kind === 'mark' && (tokens[i + 1] as { unit: Unit }).unit === 0);
  const secondDegree = withDegreeMark[1];
  if (secondDegree !== undefined) return [tokens.slice(0, secondDegree), tokens.slice(secondDegree)];
  const signed = numbers.slice(1).find((i) => (tokens[i] as { sign: string }).sign !== '');
  if (signed !== undefined) return [tokens.slice(0, signed), tokens.slice(signed)];
  if (numbers.length === 2 || numbers.length === 4 || numbers.length === 6) {
    const cut = numbers[numbers.length / 2] as number;
    return [tokens.slice(0, cut), tokens.slice(cut)];
  }
  if (numbers.length < 2) {
    throw new CoordinateError(`Expected two values, latitude and longitude; found ${numbers.length === 0 ? 'none' : 'only one'} (${EXAMPLE})`);
  }
  throw new CoordinateError(`Could not tell where the latitude ends and the longitude begins: separate them with a comma (${EXAMPLE})`);
}

interface ParsedValue {
  value: number;
  axis: 'lat' | 'lon' | null;
  letter: string | null;
}

function parseValue(tokens: Token[], which: string): ParsedValue {
  let rest = tokens;
  let letter: 'N' | 'S' | 'E' | 'W' | null = null;
  const head = rest[0];
  const tail = rest[rest.length - 1];
  if (head?.kind === 'hemisphere') {
    letter = head.letter;
    rest = rest.slice(1);
  }
  if (tail?.kind === 'hemisphere' && rest.length > 0 && rest[rest.length - 1] === tail) {
    if (letter !== null) throw new CoordinateError(`The ${which} value has two hemisphere letters (${letter} and ${tail.letter})`);
    letter = tail.letter;
    rest = rest.slice(0, -1);
  }

  const parts: Array<{ token: Extract<Token, { kind: 'number' }>; unit: Unit }> = [];
  let lastUnit = -1;
  for (let i = 0; i < rest.length; i += 1) {
    const token = rest[i] as Token;
    if (token.kind === 'hemisphere') {
      throw new CoordinateError(`The hemisphere letter ${token.letter} must stand before or after the ${which} value, not inside it`);
    }
    if (token.kind !== 'number') {
      throw new CoordinateError(`A ${token.kind === 'mark' ? 'unit mark' : 'separator'} without a number in the ${which} value`);
    }
    const next = rest[i + 1];
    let unit: number;
    if (next?.kind === 'mark') {
      unit = next.unit;
      i += 1;
    } else {
      unit = lastUnit + 1;
    }
    if (unit > 2) {
      throw new CoordinateError(`The ${which} value has more than three numbers (degrees, minutes, seconds)`);
    }
    if (unit <= lastUnit) {
      throw new CoordinateError(`In the ${which} value, ${UNIT_NAMES[unit as Unit]} come after ${UNIT_NAMES[lastUnit as Unit]}: write degrees, then minutes, then seconds`);
    }
    parts.push({ token, unit: unit as Unit });
    lastUnit = unit;
  }
  if (parts.length === 0) throw new CoordinateError(`The ${which} value has no number`);
  if ((parts[0] as { unit: Unit }).unit !== 0) throw new CoordinateError(`The ${which} value has no degrees`);

  let value = 0;
  parts.forEach((part, i) => {
    if (i > 0 && part.token.sign !== '') {
      throw new CoordinateError(`Only the degrees may carry a sign in the ${which} value`);
    }
    if (i < parts.length - 1 && part.token.text.includes('.')) {
      throw new CoordinateError(`In the ${which} value, ${UNIT_NAMES[part.unit]} with a decimal part cannot be followed by ${UNIT_NAMES[(parts[i + 1] as { unit: Unit }).unit]}`);
    }
    if (part.unit > 0 && part.token.value >= 60) {
      throw new CoordinateError(`In the ${which} value, ${UNIT_NAMES[part.unit]} must be below 60, got ${part.token.text}`);
    }
    value += part.token.value / 60 ** part.unit;
  });
  const sign = (parts[0] as { token: { sign: string } }).token.sign;
  if (letter !== null && sign === '-') {
    throw new CoordinateError(`The ${which} value has both a minus sign and the letter ${letter}: use one or the other`);
  }
  if (sign === '-' || letter === 'S' || letter === 'W') value = -value;
  const axis = letter === null ? null : letter === 'N' || letter === 'S' ? 'lat' : 'lon';
  return { value, axis, letter };
}

/**
 * Parses a typed or pasted coordinate pair (formats in the module comment).
 *
 * @param input - the text, any length up to 200 characters
 * @returns `{ ok: true, lat, lon }` in decimal degrees (lat -90..90, lon -180..180), or
 *   `{ ok: false, error }` with a message saying what is wrong
 */
export function parseCoordinates(input: string): CoordinateParseResult {
  try {
    if (typeof input !== 'string' || input.trim() === '') {
      throw new CoordinateError(`Type or paste a latitude and longitude, ${EXAMPLE}`);
    }
    if (input.length > 200) throw new CoordinateError('That is too long for a coordinate pair (over 200 characters)');
    const [firstTokens, secondTokens] = splitPair(tokenize(normalize(input)));
    const first = parseValue(firstTokens, 'first');
    const second = parseValue(secondTokens, 'second');
    if (first.axis !== null && first.axis === second.axis) {
      const kind = first.axis === 'lat' ? 'latitudes (N/S)' : 'longitudes (E/W)';
      throw new CoordinateError(`Both values are ${kind}: one must be a ${first.axis === 'lat' ? 'longitude (E/W)' : 'latitude (N/S)'}`);
    }
    const swapped = first.axis === 'lon' || second.axis === 'lat';
    const lat = swapped ? second.value : first.value;
    const lon = swapped ? first.value : second.value;
    const lettered = first.axis !== null || second.axis !== null;
    if (Math.abs(lat) > 90) {
      const hint = !lettered && Math.abs(lon) <= 90 ? ' (latitude comes first: is the pair in longitude, latitude order?)' : '';
      throw new CoordinateError(`Latitude ${lat} is out of range: it must be between -90 and 90${hint}`);
    }
    if (Math.abs(lon) > 180) {
      throw new CoordinateError(`Longitude ${lon} is out of range: it must be between -180 and 180`);
    }
    // Fold -0 to 0 so that "-0.0, 0" does not read as a negative zero.
    return { ok: true, lat: lat + 0, lon: lon + 0 };
  } catch (error) {
    if (error instanceof CoordinateError) return { ok: false, error: error.message };
    throw error;
  }
}

function checkPoint(point: GeoPoint): void {
  assertFiniteInRange(point.lat, 'lat (deg)', -90, 90);
  assertFiniteInRange(point.lon, 'lon (deg)', -180, 180);
}

function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  // Avoid "-0.000000" for values that round to zero.
  return Number(text) === 0 ? (0).toFixed(decimals) : text;
}

/**
 * Formats a point as decimal degrees, latitude first: `52.123400, -7.123400`.
 *
 * @param point - lat -90..90, lon -180..180 (degrees)
 * @param decimals - digits after the point, 0..10; default 6 (about 0.1 m)
 * @returns the text
 * @throws RangeError on NaN or out-of-range input
 */
export function formatDecimalDegrees(point: GeoPoint, decimals = 6): string {
  checkPoint(point);
  assertFiniteInRange(decimals, 'decimals', 0, 10);
  return `${fixed(point.lat, Math.round(decimals))}, ${fixed(point.lon, Math.round(decimals))}`;
}

function dms(value: number, positive: string, negative: string, secondDecimals: number): string {
  const scale = 10 ** secondDecimals;
  // Work in whole units of the last shown digit so that rounding carries into minutes and degrees.
  const units = Math.round(Math.abs(value) * 3600 * scale);
  const degrees = Math.floor(units / (3600 * scale));
  const minutes = Math.floor((units - degrees * 3600 * scale) / (60 * scale));
  const seconds = (units - degrees * 3600 * scale - minutes * 60 * scale) / scale;
  const secondsText = seconds.toFixed(secondDecimals).padStart(secondDecimals > 0 ? secondDecimals + 3 : 2, '0');
  const hemisphere = units === 0 || value > 0 ? positive : negative;
  return `${degrees}°${String(minutes).padStart(2, '0')}'${secondsText}"${hemisphere}`;
}

/**
 * Formats a point as degrees, minutes and seconds with hemisphere letters:
 * `52°07'24.2"N 7°07'24.2"W`. {@link parseCoordinates} reads it back.
 *
 * @param point - lat -90..90, lon -180..180 (degrees)
 * @param secondDecimals - digits after the seconds' point, 0..4; default 1 (about 3 m)
 * @returns the text
 * @throws RangeError on NaN or out-of-range input
 */
export function formatDms(point: GeoPoint, secondDecimals = 1): string {
  checkPoint(point);
  assertFiniteInRange(secondDecimals, 'secondDecimals', 0, 4);
  const n = Math.round(secondDecimals);
  return `${dms(point.lat, 'N', 'S', n)} ${dms(point.lon, 'E', 'W', n)}`;
}
