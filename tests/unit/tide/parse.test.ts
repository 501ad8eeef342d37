import { describe, expect, it } from 'vitest';
import { isCleanTideParse, parseTideTimes } from '../../../shared/tide';

// Europe/London is UTC+1 (BST) in May and UTC+0 (GMT) in January (from memory: UK summer time,
// last Sunday of March to last Sunday of October). Each expected UTC instant below is the local
// time minus that offset, worked by hand.
const LONDON = 'Europe/London';

describe('parseTideTimes: one good line', () => {
  it.each([
    ['2027-05-04 03:12 L 0.4', '2027-05-04T02:12:00.000Z', 'low', 0.4],
    ['2027-05-04 09:25 H 4.1', '2027-05-04T08:25:00.000Z', 'high', 4.1],
    ['2027-05-04 09:25 HW 4.1m', '2027-05-04T08:25:00.000Z', 'high', 4.1],
    ['2027-05-04 09:25 high 4.1 m', '2027-05-04T08:25:00.000Z', 'high', 4.1],
    ['2027-05-04 09:25 High Water 4.1', '2027-05-04T08:25:00.000Z', 'high', 4.1],
    ['2027-05-04 15:40:30 LW', '2027-05-04T14:40:30.000Z', 'low', undefined],
    ['2027/05/04 9:05 Low water 0.6', '2027-05-04T08:05:00.000Z', 'low', 0.6],
    ['2027-05-04T15:40 low', '2027-05-04T14:40:00.000Z', 'low', undefined],
    ['2027-05-04 15:40 0.6 L', '2027-05-04T14:40:00.000Z', 'low', 0.6],
    ['2027-05-04 15:40 L -0.2', '2027-05-04T14:40:00.000Z', 'low', -0.2],
    ['2027-05-04 15:40 L .5', '2027-05-04T14:40:00.000Z', 'low', 0.5],
    ['   2027-05-04    15:40   L   0.6   ', '2027-05-04T14:40:00.000Z', 'low', 0.6],
    ['2027-05-04 15:40 L 0.6  # neaps', '2027-05-04T14:40:00.000Z', 'low', 0.6],
    ['2027-01-10 03:12 l 0.4', '2027-01-10T03:12:00.000Z', 'low', 0.4],
    ['2027-01-10 23:59:59 h', '2027-01-10T23:59:59.000Z', 'high', undefined],
    ['2027-01-10 00:00 LW', '2027-01-10T00:00:00.000Z', 'low', undefined],
  ])('reads %j as %s (%s, %s m)', (line, at, kind, heightM) => {
    const result = parseTideTimes(line, LONDON);
    expect(result.errors).toEqual([]);
    expect(result.warnings).toEqual([]);
    expect(result.events).toEqual([{ at, kind, ...(heightM === undefined ? {} : { heightM }) }]);
  });

  it('reads the same wall time in another zone with that zone\'s offset', () => {
    // America/New_York in May is UTC-4 (EDT, from memory): 03:12 local = 07:12 UTC.
    const result = parseTideTimes('2027-05-04 03:12 L', 'America/New_York');
    expect(result.events).toEqual([{ at: '2027-05-04T07:12:00.000Z', kind: 'low' }]);
  });
});

describe('parseTideTimes: bad lines give their line number and a message', () => {
  // Each bad line is pasted as line 4, after a comment, a blank line and a good line.
  it.each([
    ['2027-05-04 09:25', /Expected H or L/],
    ['2027-05-04 H 4.1', /Expected a time as HH:MM/],
    ['2027-05-04', /Expected a time as HH:MM after the date/],
    ['09:25 H 4.1', /Expected a date as YYYY-MM-DD/],
    ['04/05/2027 09:25 H', /year first.*ambiguous/],
    ['04.05.2027 09:25 H', /year first.*ambiguous/],
    ['2027-02-29 09:25 H', /2027-02-29 is not a calendar date/],
    ['2027-13-01 09:25 H', /not a calendar date/],
    ['2027-05-04 24:00 H', /not a time of day/],
    ['2027-05-04 09:60 H', /not a time of day/],
    ['2027-05-04 9.25 H', /Expected a time as HH:MM/],
    ['2027-05-04 09:25 X 4.1', /Unexpected 'X'/],
    ['2027-05-04 09:25 H L', /Two tide kinds/],
    ['2027-05-04 09:25 H 4.1 4.2', /Two heights/],
    ['2027-05-04 09:25 H 13.5 ft', /feet/],
    ['2027-05-04 09:25 H 13.5ft', /feet/],
    ['2027-05-04 09:25 H 25', /outside -20 to 20 m/],
    ['2027-05-04 09:25 GMT H 4.1', /names a zone/],
    ['2027-05-04 09:25 H 4.1 UTC', /names a zone/],
    ['2027-05-04T09:25Z H', /names a zone/],
    ['2027-05-04 09:25+01:00 H', /names a zone/],
    ['2027-05-04,,H,4.1', /Field 2 is empty/],
    [';;;', /separators but no values/],
    ['2027-05-04 09:25 H 4,1', /Two heights.*decimals with a point/],
    ['Date,Time,Type,Height', /header row is read only as the first line/],
  ])('%j is an error on line 4 matching %s', (bad, message) => {
    const text = `# tide times\n\n2027-05-04 03:12 L 0.4\n${bad}`;
    const result = parseTideTimes(text, LONDON);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]).toMatchObject({ line: 4, text: bad });
    expect(result.errors[0]!.message).toMatch(message);
    expect(result.events).toEqual([{ at: '2027-05-04T02:12:00.000Z', kind: 'low', heightM: 0.4 }]);
    expect(isCleanTideParse(result)).toBe(false);
  });

  it('reports every bad line of a longer paste in line order and keeps the good ones', () => {
    const text = [
      '2027-05-04 03:12 L 0.4', // 1
      '2027-05-04 09:25 Q 4.1', // 2 bad kind
      '2027-05-04 15:40 L 0.6', // 3
      '', // 4
      '2027-05-04 2155 H 4.0', // 5 no colon
      '2027-05-05 04:01 L 0.5', // 6
    ].join('\n');
    const result = parseTideTimes(text, LONDON);
    expect(result.errors.map((e) => e.line)).toEqual([2, 5]);
    expect(result.events.map((e) => e.at)).toEqual([
      '2027-05-04T02:12:00.000Z',
      '2027-05-04T14:40:00.000Z',
      '2027-05-05T03:01:00.000Z',
    ]);
  });
});

describe('parseTideTimes: CSV variants', () => {
  const expected = [
    { at: '2027-05-04T02:12:00.000Z', kind: 'low', heightM: 0.4 },
    { at: '2027-05-04T08:25:00.000Z', kind: 'high', heightM: 4.1 },
  ];
  it.each([
    ['comma, header', 'Date,Time,Type,Height\n2027-05-04,03:12,L,0.4\n2027-05-04,09:25,H,4.1'],
    ['comma, no header', '2027-05-04,03:12,L,0.4\n2027-05-04,09:25,H,4.1'],
    ['comma with spaces and units', '2027-05-04, 03:12, LW, 0.4 m\n2027-05-04, 09:25, HW, 4.1 m'],
    ['quoted fields', '"date","time","tide","height (m)"\n"2027-05-04","03:12","L","0.4"\n"2027-05-04","09:25","H","4.1"'],
    ['semicolon, decimal comma', 'Datum;Time;H/L;Height\n2027-05-04;03:12;L;0,4\n2027-05-04;09:25;H;4,1'],
    ['semicolon, decimal point', '2027-05-04;03:12:00;Low;0.4\n2027-05-04;09:25:00;High;4.1'],
    ['tab, header', 'date\ttime\tkind\theight\n2027-05-04\t03:12\tL\t0.4\n2027-05-04\t09:25\tH\t4.1'],
    ['CRLF line breaks and a byte-order mark', '\uFEFFDate,Time,Type,Height\r\n2027-05-04,03:12,L,0.4\r\n2027-05-04,09:25,H,4.1\r\n'],
    ['trailing separators', '2027-05-04,03:12,L,0.4,\n2027-05-04;09:25;H;4,1;'],
    ['lines out of order', '2027-05-04 09:25 H 4.1\n2027-05-04 03:12 L 0.4'],
    ['comments and blank lines', '# Port: somewhere\n\n2027-05-04 03:12 L 0.4 # springs\n   \n# next\n2027-05-04 09:25 H 4.1\n'],
  ])('%s: reads both events, sorted by time', (_label, text) => {
    const result = parseTideTimes(text, LONDON);
    expect(result.errors).toEqual([]);
    expect(result.events).toEqual(expected);
    expect(isCleanTideParse(result)).toBe(true);
  });

  it('reads a CSV line with the height field left empty', () => {
    const result = parseTideTimes('date,time,type,height\n2027-05-04,03:12,L,\n', LONDON);
    expect(result.errors).toEqual([]);
    expect(result.events).toEqual([{ at: '2027-05-04T02:12:00.000Z', kind: 'low' }]);
  });

  it('counts a header, comment and blank lines in the line numbers', () => {
    const result = parseTideTimes('Date,Time,Type,Height\n# c\n\n2027-05-04,03:12,Z,0.4', LONDON);
    expect(result.errors).toEqual([expect.objectContaining({ line: 4 })]);
  });
});

describe('parseTideTimes: daylight-saving changes in Europe/London', () => {
  // From memory: in 2027 UK clocks go forward on Sunday 28 March at 01:00 GMT (local 01:00 -> 02:00)
  // and back on Sunday 31 October at 02:00 BST (local 02:00 -> 01:00). So local 01:00:00-01:59:59
  // does not exist on 28 March and happens twice on 31 October.
  it.each(['2027-03-28 01:00 L', '2027-03-28 01:30 L', '2027-03-28 01:59:59 L'])(
    '%j does not exist: error naming the clocks going forward', (line) => {
      const result = parseTideTimes(line, LONDON);
      expect(result.events).toEqual([]);
      expect(result.errors).toHaveLength(1);
      expect(result.errors[0]).toMatchObject({ line: 1 });
      expect(result.errors[0]!.message).toMatch(/does not exist in Europe\/London.*forward/);
    });

  it.each([
    ['2027-03-28 00:59 L', '2027-03-28T00:59:00.000Z'],
    ['2027-03-28 02:00 L', '2027-03-28T01:00:00.000Z'],
    ['2027-10-31 00:59 L', '2027-10-30T23:59:00.000Z'],
    ['2027-10-31 02:00 L', '2027-10-31T02:00:00.000Z'],
  ])('%j next to a change is read without doubt as %s', (line, at) => {
    const result = parseTideTimes(line, LONDON);
    expect(result.errors).toEqual([]);
    expect(result.warnings).toEqual([]);
    expect(result.events).toEqual([{ at, kind: 'low' }]);
  });

  it.each([
    ['2027-10-31 01:00 H', '2027-10-31T00:00:00.000Z'],
    ['2027-10-31 01:30 H', '2027-10-31T00:30:00.000Z'],
    ['2027-10-31 01:59:59 H', '2027-10-31T00:59:59.000Z'],
  ])('%j happens twice: read as the earlier (BST) instant %s with a warning', (line, at) => {
    const result = parseTideTimes(line, LONDON);
    expect(result.errors).toEqual([]);
    expect(result.events).toEqual([{ at, kind: 'high' }]);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatchObject({ line: 1, text: line });
    expect(result.warnings[0]!.message).toMatch(/happens twice.*earlier.*UTC\+01:00/);
    expect(isCleanTideParse(result)).toBe(true);
  });

  it('reads the ambiguous hour in a southern-hemisphere zone too (Australia/Sydney)', () => {
    // From memory: Sydney daylight saving ends on Sunday 4 April 2027 at 03:00 AEDT (UTC+11),
    // clocks back to 02:00 AEST (UTC+10): 02:30 local happens twice, earlier = 15:30 UTC on 3 April.
    const result = parseTideTimes('2027-04-04 02:30 L', 'Australia/Sydney');
    expect(result.events).toEqual([{ at: '2027-04-03T15:30:00.000Z', kind: 'low' }]);
    expect(result.warnings[0]!.message).toMatch(/UTC\+11:00/);
  });
});

describe('parseTideTimes: sequence checks', () => {
  it('a clean semidiurnal day gives no warnings', () => {
    // Intervals 6 h 13 min, 6 h 15 min, 6 h 15 min: the usual pattern ('common practice').
    const text = '2027-05-04 03:12 L 0.4\n2027-05-04 09:25 H 4.1\n2027-05-04 15:40 L 0.6\n2027-05-04 21:55 H 4.0';
    const result = parseTideTimes(text, LONDON);
    expect(result.warnings).toEqual([]);
    expect(result.errors).toEqual([]);
    expect(result.events).toHaveLength(4);
  });

  it.each([
    ['two highs in a row', '2027-05-04 03:12 H 4.0\n2027-05-04 09:25 H 4.1', 2, /Two high waters in a row \(lines 1 and 2\)/],
    ['two lows in a row', '2027-05-04 03:12 L\n2027-05-04 09:25 L', 2, /Two low waters in a row/],
    ['events 1 h 30 min apart', '2027-05-04 03:12 L\n2027-05-04 04:42 H', 2, /Only 1 h 30 min between lines 1 and 2.*6 h 12 min/],
    ['a gap of 18 h', '2027-05-04 03:12 L\n2027-05-04 21:12 H', 2, /18 h 00 min between lines 1 and 2.*missing/],
    ['a high below its low', '2027-05-04 03:12 L 4.1\n2027-05-04 09:25 H 0.4', 2, /High water 0.4 m is not above the low water 4.1 m/],
  ])('%s is a warning on the later event', (_label, text, line, message) => {
    const result = parseTideTimes(text, LONDON);
    expect(result.errors).toEqual([]);
    expect(result.events).toHaveLength(2);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]!.line).toBe(line);
    expect(result.warnings[0]!.message).toMatch(message);
    expect(isCleanTideParse(result)).toBe(true);
  });

  it('a gap of exactly 14 h and a spacing of exactly 2 h are not flagged', () => {
    const result = parseTideTimes('2027-05-04 01:00 L\n2027-05-04 03:00 H\n2027-05-04 17:00 L', LONDON);
    expect(result.warnings).toEqual([]);
  });

  it('checks the sequence in time order, not paste order', () => {
    // Pasted H 09:25, H 21:55, L 15:40: in time order they alternate, so no warning.
    const result = parseTideTimes('2027-05-04 09:25 H\n2027-05-04 21:55 H\n2027-05-04 15:40 L', LONDON);
    expect(result.warnings).toEqual([]);
    expect(result.events.map((e) => e.kind)).toEqual(['high', 'low', 'high']);
  });

  it.each([
    ['the same line twice', '2027-05-04 03:12 L 0.4\n2027-05-04 09:25 H\n2027-05-04 03:12 L 0.4', 3, 1],
    ['the same instant with another kind', '2027-05-04 03:12 L\n2027-05-04 03:12 H', 2, 1],
    ['the same instant written with seconds', '2027-05-04 03:12:00 L\n2027-05-04 03:12 L', 2, 1],
  ])('%s is an error on the later line, which is dropped', (_label, text, line, firstLine) => {
    const result = parseTideTimes(text, LONDON);
    expect(result.errors).toHaveLength(1);
    expect(result.errors[0]!.line).toBe(line);
    expect(result.errors[0]!.message).toMatch(new RegExp(`Same time as line ${firstLine}`));
    expect(new Set(result.events.map((e) => e.at)).size).toBe(result.events.length);
    expect(isCleanTideParse(result)).toBe(false);
  });
});

describe('parseTideTimes: input guards and empty input', () => {
  it('an empty or comment-only text is clean with no events', () => {
    for (const text of ['', '\n\n', '# nothing yet\n']) {
      const result = parseTideTimes(text, LONDON);
      expect(result).toEqual({ events: [], errors: [], warnings: [] });
      expect(isCleanTideParse(result)).toBe(true);
    }
  });

  it('a header alone is clean with no events', () => {
    expect(parseTideTimes('Date,Time,Type,Height', LONDON)).toEqual({ events: [], errors: [], warnings: [] });
  });

  it.each([
    ['an unknown zone', 'Europe/Atlantis'],
    ['an empty zone', ''],
    ['a zone that is not a string', 1 as unknown as string],
  ])('throws a RangeError for %s', (_label, zone) => {
    expect(() => parseTideTimes('2027-05-04 03:12 L', zone)).toThrow(RangeError);
  });

  it('throws a RangeError when the text is not a string', () => {
    expect(() => parseTideTimes(undefined as unknown as string, LONDON)).toThrow(RangeError);
  });

  it('throws a RangeError when the text has more than 5000 lines', () => {
    expect(() => parseTideTimes('\n'.repeat(5000), LONDON)).toThrow(/at most 5000 lines/);
    expect(() => parseTideTimes('\n'.repeat(4999), LONDON)).not.toThrow();
  });
});
