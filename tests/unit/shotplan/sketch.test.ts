import { describe, expect, it } from 'vitest';
import { azAltBox, timelineBarLayout } from '../../../shared/shotplan/sketch';

const T0 = Date.parse('2027-07-04T22:00:00Z');
const MIN = 60_000;

describe('timelineBarLayout', () => {
  it('maps the span of events and blocks, padded 5 % each side, onto the width', () => {
    const bar = timelineBarLayout(
      [{ kind: 'astronomical-dusk', label: 'Dusk', atMs: T0 }, { kind: 'astronomical-dawn', label: 'Dawn', atMs: T0 + 100 * MIN }],
      [{ kind: 'sky-stack', label: 'Stack', startMs: T0 + 10 * MIN, endMs: T0 + 40 * MIN, late: false }],
      1100,
    );
    // Worked by hand: a 100-minute span padded by 5 minutes each side is 110 minutes over 1100 units.
    expect(bar.startMs).toBe(T0 - 5 * MIN);
    expect(bar.endMs).toBe(T0 + 105 * MIN);
    expect(bar.events.map((e) => e.x)).toEqual([50, 1050]);
    expect(bar.blocks[0]).toMatchObject({ x: 150, w: 300, late: false });
  });

  it('keeps a very short block visible', () => {
    const bar = timelineBarLayout([{ kind: 'lineup-start', label: 'Start', atMs: T0 }, { kind: 'lineup-end', label: 'End', atMs: T0 + 600 * MIN }], [
      { kind: 'foreground', label: 'One frame', startMs: T0 + MIN, endMs: T0 + MIN + 1000, late: true },
    ], 1000);
    expect(bar.blocks[0]!.w).toBe(2);
    expect(bar.blocks[0]!.late).toBe(true);
  });

  it('spreads labels that would overlap over lanes and reuses a lane once it is free', () => {
    const events = [0, 2, 4, 90].map((m, i) => ({ kind: `k${i}`, label: `L${i}`, atMs: T0 + m * MIN }));
    const bar = timelineBarLayout(events, [], 1000, { labelWidths: [100, 100, 100, 100], lanes: 4, labelGap: 4 });
    expect(bar.events.map((e) => e.lane)).toEqual([0, 1, 2, 0]);
    // Labels stay inside the bar: the first one's left edge is clamped to 0.
    expect(bar.events[0]!.labelX).toBe(0);
    expect(bar.events[3]!.labelX).toBeLessThanOrEqual(900);
    // With two lanes the third label finds none free: it shares the lane that frees first, or is left out.
    expect(timelineBarLayout(events, [], 1000, { labelWidths: [100, 100, 100, 100], lanes: 2, labelGap: 4 }).events.map((e) => e.lane)).toEqual([0, 1, 0, 0]);
    expect(timelineBarLayout(events, [], 1000, { labelWidths: [100, 100, 100, 100], lanes: 2, labelGap: 4, dropOverflow: true }).events.map((e) => e.lane)).toEqual([0, 1, -1, 0]);
    // Without widths every label is in lane 0.
    expect(timelineBarLayout(events, [], 1000).events.every((e) => e.lane === 0)).toBe(true);
  });

  it('refuses nothing to place, a block that ends before it starts and a bad width', () => {
    expect(() => timelineBarLayout([], [], 100)).toThrow(RangeError);
    expect(() => timelineBarLayout([], [{ kind: 'x', label: 'x', startMs: T0, endMs: T0 - 1, late: false }], 100)).toThrow(/ends before/);
    expect(() => timelineBarLayout([{ kind: 'x', label: 'x', atMs: T0 }], [], 0)).toThrow(RangeError);
    expect(() => timelineBarLayout([{ kind: 'x', label: 'x', atMs: T0 }], [], 100, { labelWidths: [] })).toThrow(/one width per event/);
  });
});

describe('azAltBox', () => {
  it('unwraps a set across north around the given azimuth and adds the margin', () => {
    const box = azAltBox([{ azimuthDeg: 350, altitudeDeg: 5 }, { azimuthDeg: 15, altitudeDeg: 40 }], 0, 5, 20);
    expect(box).toEqual({ fromAzDeg: -15, toAzDeg: 20, bottomAltDeg: 0, topAltDeg: 45, centreAzDeg: 0 });
  });

  it('widens a small set to the smallest span about its middle and clamps at the zenith', () => {
    const box = azAltBox([{ azimuthDeg: 100, altitudeDeg: 85 }], 100, 2, 20);
    expect(box.fromAzDeg).toBe(90);
    expect(box.toAzDeg).toBe(110);
    expect(box.topAltDeg).toBe(90);
    expect(box.bottomAltDeg).toBe(75);
  });

  it('refuses an empty set', () => {
    expect(() => azAltBox([], 0)).toThrow(RangeError);
  });
});
