import { describe, expect, it } from 'vitest';
import { findTarget, normalizeForSearch, searchTargets, TARGETS } from '../../../shared/sky/catalogue';
import { GALACTIC_CENTRE_J2000 } from '../../../shared/sky/galactic';

const hms = (h: number, m: number, s: number): number => h + m / 60 + s / 3600;
const dms = (sign: 1 | -1, d: number, m: number, s: number): number => sign * (d + m / 60 + s / 3600);
function separationArcmin(a: { raHours: number; decDeg: number }, b: { raHours: number; decDeg: number }): number {
  const r = Math.PI / 180;
  const c =
    Math.sin(a.decDeg * r) * Math.sin(b.decDeg * r) + Math.cos(a.decDeg * r) * Math.cos(b.decDeg * r) * Math.cos((a.raHours - b.raHours) * 15 * r);
  return (Math.acos(Math.max(-1, Math.min(1, c))) / r) * 60;
}

describe('catalogue positions', () => {
  // REFERENCES.md, Sky positions J2000, deep-sky objects (OpenNGC, mattiaverga/OpenNGC,
  // NGC.csv and addendum.csv, CC-BY-SA-4.0). Planning needs about 1 arcmin.
  it.each([
    ['m42', hms(5, 35, 16.48), dms(-1, 5, 23, 22.8)],
    ['m45', hms(3, 47, 28.6), dms(1, 24, 6, 19)],
    ['ngc1499', hms(4, 3, 14.42), dms(1, 36, 22, 2.9)],
    ['ngc7000', hms(20, 59, 17.14), dms(1, 44, 31, 43.6)],
    ['m31', hms(0, 42, 44.35), dms(1, 41, 16, 8.6)],
    ['ic4604', hms(16, 25, 31.17), dms(-1, 23, 26, 11.7)],
    ['m8', hms(18, 3, 41.27), dms(-1, 24, 22, 48.6)],
  ])('%s is at the OpenNGC position within 1 arcmin', (id, raHours, decDeg) => {
    const t = findTarget(id);
    expect(t).toBeDefined();
    expect(separationArcmin(t ?? { raHours: 0, decDeg: 0 }, { raHours, decDeg })).toBeLessThan(1);
  });

  // REFERENCES.md: the galactic centre, l = 0, b = 0, at 17h45m37.20s -28d56m10.2s (1 arcsec).
  it('puts the galactic centre at l = 0, b = 0', () => {
    const gc = findTarget('galactic-centre');
    expect(gc?.type).toBe('galactic-centre');
    expect(gc?.raHours).toBe(GALACTIC_CENTRE_J2000.raHours);
    expect(separationArcmin(gc ?? { raHours: 0, decDeg: 0 }, { raHours: hms(17, 45, 37.2), decDeg: dms(-1, 28, 56, 10.2) }) * 60).toBeLessThan(1);
  });
});

describe('catalogue integrity', () => {
  it('holds the galactic centre and at least 60 deep-sky objects', () => {
    expect(TARGETS[0]?.id).toBe('galactic-centre');
    expect(TARGETS.filter((t) => t.openNgcRow !== undefined).length).toBeGreaterThanOrEqual(60);
  });

  it('has unique, lower-case ids', () => {
    const ids = TARGETS.map((t) => t.id);
    expect(new Set(ids).size).toBe(ids.length);
    for (const id of ids) expect(id).toMatch(/^[a-z0-9][a-z0-9-]*$/);
  });

  it('has no designation on two targets', () => {
    const seen = new Map<string, string>();
    for (const t of TARGETS) {
      for (const d of t.designations) {
        const key = normalizeForSearch(d);
        expect(seen.get(key) ?? t.id).toBe(t.id);
        seen.set(key, t.id);
      }
    }
  });

  it('keeps every value in range', () => {
    for (const t of TARGETS) {
      expect(t.raHours).toBeGreaterThanOrEqual(0);
      expect(t.raHours).toBeLessThan(24);
      expect(Math.abs(t.decDeg)).toBeLessThanOrEqual(90);
      expect(t.name.length).toBeGreaterThan(0);
      expect(t.designations.length).toBeGreaterThan(0);
      expect(t.constellation).toMatch(/^[A-Z][A-Za-z]{2}$/);
      if (t.sizeArcmin !== null) {
        expect(t.sizeArcmin.major).toBeGreaterThan(0);
        expect(t.sizeArcmin.major).toBeLessThan(1000);
        expect(t.sizeArcmin.minor).toBeGreaterThan(0);
        expect(t.sizeArcmin.minor).toBeLessThanOrEqual(t.sizeArcmin.major);
      }
      if (t.id !== 'galactic-centre') expect(t.openNgcRow).toMatch(/^(NGC|addendum)\.csv \S+$/);
    }
  });

  // The id is the designation it is searched by: each id matches one of its own designations
  // (normalized), so findTarget and searchTargets agree.
  it('derives each id from one of its designations', () => {
    for (const t of TARGETS.slice(1)) {
      expect(t.designations.map(normalizeForSearch)).toContain(normalizeForSearch(t.id));
    }
  });

  it('is frozen', () => {
    expect(Object.isFrozen(TARGETS)).toBe(true);
    expect(Object.isFrozen(TARGETS[1])).toBe(true);
  });
});

describe('finding targets', () => {
  it('finds by id, case-insensitive', () => {
    expect(findTarget('m42')?.name).toBe('Orion Nebula');
    expect(findTarget(' NGC7000 ')?.id).toBe('ngc7000');
    expect(findTarget('m999')).toBeUndefined();
  });

  it.each([
    ['M 42', 'm42'],
    ['m42', 'm42'],
    ['Messier 42', 'm42'],
    ['NGC1976', 'm42'],
    ['NGC7000', 'ngc7000'],
    ['ngc 7000', 'ngc7000'],
    ['north america', 'ngc7000'],
    ['NGC 0224', 'm31'],
    ['andromeda', 'm31'],
    ['IC 434', 'ic434'],
    ['horsehead', 'b33'],
    ['Barnard 33', 'b33'],
    ['pleiades', 'm45'],
    ['Sh2-155', 'c9'],
    ['galactic center', 'galactic-centre'],
    ['LMC', 'eso56-115'],
    ['ROSETTE', 'ngc2237'],
  ])('search %j puts %s first', (query, id) => {
    expect(searchTargets(query)[0]?.id).toBe(id);
  });

  it('finds every target containing a word ("orion" -> the Orion Nebula first)', () => {
    const ids = searchTargets('orion').map((t) => t.id);
    expect(ids[0]).toBe('m42');
    expect(ids).not.toContain('ngc7000');
  });

  it('ranks exact designations before prefixes ("M 4" -> M4 first, then M42...)', () => {
    const ids = searchTargets('M 4').map((t) => t.id);
    expect(ids[0]).toBe('m4');
    expect(ids).toContain('m42');
    expect(ids).toContain('m45');
  });

  it('limits and guards', () => {
    expect(searchTargets('nebula', 3)).toHaveLength(3);
    expect(searchTargets('   ')).toEqual([]);
    expect(searchTargets('zzzz-not-a-target')).toEqual([]);
    expect(() => searchTargets('m42', 0)).toThrow(RangeError);
    expect(() => searchTargets('x'.repeat(201))).toThrow(RangeError);
    expect(() => searchTargets(42 as unknown as string)).toThrow(RangeError);
    expect(() => findTarget(undefined as unknown as string)).toThrow(RangeError);
  });
});
