import { describe, expect, it } from 'vitest';
import type { NightReport } from '../../../shared/sky/night';
import { TIDE_CAUTION } from '../../../shared/tide/caution';
import { fieldOfView, heldFieldOfView } from '../../../shared/shotplan/framing';
import { panoramaGrid } from '../../../shared/shotplan/panorama';
import {
  framesBlock,
  nightEventsFromReport,
  nightTimelineEvents,
  panoramaRowBlocks,
  planNight,
  type ShootingBlock,
} from '../../../shared/shotplan/timeline';

const at = (iso: string) => new Date(iso);

/**
 * A fixed night (invented times, UTC): dark from 22:48, the lineup 23:05 to 01:15 with its peak at
 * 00:10, moonrise 01:00, the tide cuts the spot off at 01:40, dawn twilight from 02:20.
 */
const night = {
  astronomicalDusk: at('2027-07-04T22:48:00Z'),
  lineupStart: at('2027-07-04T23:05:00Z'),
  lineupPeak: at('2027-07-05T00:10:00Z'),
  lineupEnd: at('2027-07-05T01:15:00Z'),
  moonrise: at('2027-07-05T01:00:00Z'),
  tideCutOff: at('2027-07-05T01:40:00Z'),
  astronomicalDawn: at('2027-07-05T02:20:00Z'),
};

describe('nightTimelineEvents', () => {
  it('sorts the night into time order', () => {
    const events = nightTimelineEvents(night);
    expect(events.map((e) => e.kind)).toEqual([
      'astronomical-dusk', 'lineup-start', 'lineup-peak', 'moonrise', 'lineup-end', 'tide-cut-off', 'astronomical-dawn',
    ]);
    expect(events[0]).toEqual({ kind: 'astronomical-dusk', label: 'End of astronomical twilight', at: night.astronomicalDusk });
  });

  it('leaves out missing events and orders events at one instant by kind', () => {
    const events = nightTimelineEvents({ ...night, tideCutOff: null, astronomicalDawn: undefined, moonrise: night.lineupEnd });
    expect(events.map((e) => e.kind)).toEqual(['astronomical-dusk', 'lineup-start', 'lineup-peak', 'lineup-end', 'moonrise']);
    expect(nightTimelineEvents({})).toEqual([]);
  });

  it('refuses an invalid instant and a lineup out of order', () => {
    expect(() => nightTimelineEvents({ moonrise: new Date(Number.NaN) })).toThrow(/events\.moonrise/);
    expect(() => nightTimelineEvents({ lineupStart: night.lineupEnd, lineupEnd: night.lineupStart })).toThrow(RangeError);
  });
});

describe('planNight: blocks laid out from a start with gaps, and deadline warnings', () => {
  const blocks: ShootingBlock[] = [
    { kind: 'foreground', label: 'Foreground frames', durationS: 20 * 60 },
    { kind: 'sky-stack', label: 'Sky stack', durationS: 90 * 60 },
    { kind: 'panorama-row', label: 'Panorama row 1', durationS: 15 * 60 },
    { kind: 'panorama-row', label: 'Panorama row 2', durationS: 15 * 60 },
    { kind: 'foreground', label: 'Foreground at low tide', durationS: 40 * 60 },
    { kind: 'sky-stack', label: 'Late sky stack', durationS: 20 * 60, gapBeforeS: 0 },
  ];
  const plan = planNight(night, blocks, at('2027-07-04T23:00:00Z'));

  it('places each block after the previous one and a one-minute gap', () => {
    // Worked by hand: 23:00-23:20, +1 min 23:21-00:51, 00:52-01:07, 01:08-01:23, 01:24-02:04, no gap 02:04-02:24.
    expect(plan.blocks.map((b) => [b.start.toISOString().slice(11, 16), b.end.toISOString().slice(11, 16)])).toEqual([
      ['23:00', '23:20'], ['23:21', '00:51'], ['00:52', '01:07'], ['01:08', '01:23'], ['01:24', '02:04'], ['02:04', '02:24'],
    ]);
    expect(plan.endsAt).toEqual(at('2027-07-05T02:24:00Z'));
  });

  it('warns for each block past a deadline it must meet, naming the block and the deadline', () => {
    expect(plan.warnings.map((w) => [w.blockLabel, w.deadline, Math.round(w.overrunS / 60), w.startsAfter])).toEqual([
      // 01:07 is 7 min after moonrise (01:00); it ends before the lineup does (01:15).
      ['Panorama row 1', 'moonrise', 7, false],
      // 01:23 is 8 min after the lineup's end; it starts (01:08) after moonrise.
      ['Panorama row 2', 'lineup-end', 8, false],
      ['Panorama row 2', 'moonrise', 23, true],
      // Foreground frames answer to the tide only: 02:04 is 24 min after the 01:40 cut-off.
      ['Foreground at low tide', 'tide-cut-off', 24, false],
      // The late stack starts after everything but dawn (02:20), which it runs 4 min past.
      ['Late sky stack', 'lineup-end', 69, true],
      ['Late sky stack', 'moonrise', 84, true],
      ['Late sky stack', 'tide-cut-off', 44, true],
      ['Late sky stack', 'astronomical-dawn', 4, false],
    ]);
    expect(plan.warnings[0]!.message).toBe('Panorama row 1 ends 7 min after moonrise.');
    expect(plan.warnings[1]!.message).toBe('Panorama row 2 ends 8 min after the end of the lineup.');
    expect(plan.warnings[3]!.message).toBe('Foreground at low tide ends 24 min after the tide cut-off.');
    expect(plan.warnings[6]!.message).toBe('Late sky stack starts after the tide cut-off.');
    expect(plan.warnings[7]!.deadlineAt).toEqual(night.astronomicalDawn);
  });

  it('no warning for blocks that end in time, and the tide caution goes with a tide cut-off', () => {
    expect(plan.warnings.some((w) => w.blockIndex < 2)).toBe(false);
    expect(plan.cautions).toEqual([TIDE_CAUTION]);
    expect(planNight({ ...night, tideCutOff: null }, blocks.slice(0, 2), at('2027-07-04T23:00:00Z')).cautions).toEqual([]);
  });

  it('a missing deadline gives no warning', () => {
    const noMoon = planNight({ ...night, moonrise: null }, blocks.slice(0, 3), at('2027-07-04T23:00:00Z'));
    expect(noMoon.warnings).toEqual([]);
  });

  it('takes a gap of its own', () => {
    const p = planNight(night, blocks.slice(0, 2), at('2027-07-04T23:00:00Z'), { gapS: 300 });
    expect(p.blocks[1]!.start).toEqual(at('2027-07-04T23:25:00Z'));
  });

  it.each([
    [[{ kind: 'timelapse', label: 'x', durationS: 60 }], /kind must be one of/],
    [[{ kind: 'sky-stack', label: ' ', durationS: 60 }], /label/],
    [[{ kind: 'sky-stack', label: 'x', durationS: 0 }], /durationS must be above 0/],
    [[{ kind: 'sky-stack', label: 'x', durationS: 60, gapBeforeS: -1 }], /gapBeforeS/],
  ])('refuses blocks %j', (bad, message) => {
    expect(() => planNight(night, bad as ShootingBlock[], at('2027-07-04T23:00:00Z'))).toThrow(message);
  });

  it('refuses an invalid start', () => {
    expect(() => planNight(night, [], new Date(Number.NaN))).toThrow(RangeError);
  });
});

describe('blocks from frames and panorama grids', () => {
  it('a block of frames lasts frames x exposure + gaps between frames', () => {
    // computed: 60 x 60 s + 59 x 2 s = 3718 s.
    expect(framesBlock('sky-stack', 'Sky stack', 60, 60, 2)).toEqual({ kind: 'sky-stack', label: 'Sky stack', durationS: 3718 });
    expect(() => framesBlock('sky-stack', 'Sky stack', 1.5, 60)).toThrow(RangeError);
  });

  it('a panorama grid gives one block per row', () => {
    // The 24 mm portrait ring from 0 to 30 deg is one row of 10 frames (see panorama.test.ts):
    // 10 x 20 s + 9 x 5 s = 245 s.
    const grid = panoramaGrid({ fromAzDeg: 0, toAzDeg: 0, fullCircle: true, bottomAltDeg: 0, topAltDeg: 30 }, heldFieldOfView(fieldOfView(24, { widthMm: 36, heightMm: 24 }), 'portrait'));
    expect(panoramaRowBlocks(grid, 20, 5)).toEqual([{ kind: 'panorama-row', label: 'Panorama row 1 (10 frames)', durationS: 245 }]);
  });
});

describe('nightEventsFromReport', () => {
  const local = (iso: string) => ({ utc: at(iso), timeZone: 'UTC', local: iso, zoneLabel: 'UTC' });

  it('takes the twilights and the first moonrise after dark, with the lineup and the tide cut-off', () => {
    // A night whose Moon is up at dusk, sets, and rises again at 02:00: the rise that ends the dark is 02:00.
    const report = {
      astronomicalDusk: local('2027-07-04T22:48:00Z'),
      astronomicalDawn: local('2027-07-05T02:20:00Z'),
      moonrise: local('2027-07-04T20:00:00Z'),
      moonEvents: [
        { kind: 'rise', at: local('2027-07-04T20:00:00Z') },
        { kind: 'set', at: local('2027-07-04T23:30:00Z') },
        { kind: 'rise', at: local('2027-07-05T02:00:00Z') },
      ],
    } as unknown as NightReport;
    const lineup = { start: night.lineupStart, peak: night.lineupPeak, end: night.lineupEnd };
    expect(nightEventsFromReport(report, lineup, night.tideCutOff)).toEqual({
      astronomicalDusk: at('2027-07-04T22:48:00Z'),
      lineupStart: night.lineupStart,
      lineupPeak: night.lineupPeak,
      lineupEnd: night.lineupEnd,
      moonrise: at('2027-07-05T02:00:00Z'),
      tideCutOff: night.tideCutOff,
      astronomicalDawn: at('2027-07-05T02:20:00Z'),
    });
  });

  it('a night without astronomical darkness keeps the report moonrise and no twilights', () => {
    const report = { astronomicalDusk: null, astronomicalDawn: null, moonrise: local('2027-06-21T23:10:00Z'), moonEvents: [] } as unknown as NightReport;
    expect(nightEventsFromReport(report)).toMatchObject({ astronomicalDusk: null, moonrise: at('2027-06-21T23:10:00Z'), lineupStart: null, tideCutOff: null });
    expect(() => nightEventsFromReport(null as never)).toThrow(RangeError);
    expect(() => nightEventsFromReport(report, null, new Date(Number.NaN))).toThrow(/tideCutOffAt/);
  });
});
