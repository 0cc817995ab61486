import { describe, expect, it } from 'vitest';
import { combineDateAndTime, parseTimeOfDay, parseTimestamp, spreadsheetSerialToWall } from './timestamp-parsing';

const wall = (year: number, month: number, day: number, hour = 0, minute = 0, second = 0) => ({
  year,
  month,
  day,
  hour,
  minute,
  second,
});

describe('parseTimestamp', () => {
  it('ISO without offset → local wall time', () => {
    expect(parseTimestamp('2026-11-01T01:30')).toEqual({
      ok: true,
      kind: 'wall',
      wall: wall(2026, 11, 1, 1, 30),
      dateOnly: false,
    });
    expect(parseTimestamp('2026-11-01 01:30:15')).toEqual({
      ok: true,
      kind: 'wall',
      wall: wall(2026, 11, 1, 1, 30, 15),
      dateOnly: false,
    });
  });

  it('the common yyyy-mm-dd hh:mm form reads like the general ISO path, leap days and refusals included', () => {
    expect(parseTimestamp('2024-02-29 23:59')).toEqual({
      ok: true,
      kind: 'wall',
      wall: wall(2024, 2, 29, 23, 59),
      dateOnly: false,
    });
    expect(parseTimestamp(' 2026-11-01t01:30:05 ')).toEqual({
      ok: true,
      kind: 'wall',
      wall: wall(2026, 11, 1, 1, 30, 5),
      dateOnly: false,
    });
    expect(parseTimestamp('2026-02-29 10:00')).toEqual({
      ok: false,
      message: '"2026-02-29 10:00" is not a calendar date',
    });
    expect(parseTimestamp('2100-02-29 10:00')).toEqual({
      ok: false,
      message: '"2100-02-29 10:00" is not a calendar date',
    });
    expect(parseTimestamp('2026-04-31 10:00')).toEqual({
      ok: false,
      message: '"2026-04-31 10:00" is not a calendar date',
    });
    expect(parseTimestamp('2026-11-01 25:00')).toEqual({
      ok: false,
      message: '"2026-11-01 25:00" has an impossible time of day',
    });
    expect(parseTimestamp('2026-11-01 10:60:00')).toEqual({
      ok: false,
      message: '"2026-11-01 10:60:00" has an impossible time of day',
    });
  });

  it('ISO with Z or an offset → exact instant', () => {
    expect(parseTimestamp('2026-11-01T08:30:00Z')).toEqual({
      ok: true,
      kind: 'instant',
      utcMs: Date.UTC(2026, 10, 1, 8, 30),
    });
    expect(parseTimestamp('2026-11-01T01:30:00-07:00')).toEqual({
      ok: true,
      kind: 'instant',
      utcMs: Date.UTC(2026, 10, 1, 8, 30),
    });
    expect(parseTimestamp('2026-11-01 01:30-0800')).toEqual({
      ok: true,
      kind: 'instant',
      utcMs: Date.UTC(2026, 10, 1, 9, 30),
    });
    expect(parseTimestamp('2026-11-01T05:30+05:30')).toEqual({
      ok: true,
      kind: 'instant',
      utcMs: Date.UTC(2026, 10, 1, 0, 0),
    });
  });

  it('yyyy-mm-dd → date only at local midnight', () => {
    expect(parseTimestamp('2026-03-08')).toEqual({ ok: true, kind: 'wall', wall: wall(2026, 3, 8), dateOnly: true });
  });

  it('US m/d/yyyy h:mm AM/PM', () => {
    expect(parseTimestamp('11/1/2026 1:00 AM')).toMatchObject({ wall: wall(2026, 11, 1, 1) });
    expect(parseTimestamp('11/1/2026 12:00 AM')).toMatchObject({ wall: wall(2026, 11, 1, 0) });
    expect(parseTimestamp('11/1/2026 12:30 PM')).toMatchObject({ wall: wall(2026, 11, 1, 12, 30) });
    expect(parseTimestamp('3/8/2026 11:45 pm')).toMatchObject({ wall: wall(2026, 3, 8, 23, 45) });
  });

  it('US m/d/yyyy HH:mm and date only', () => {
    expect(parseTimestamp('03/08/2026 14:05')).toMatchObject({ wall: wall(2026, 3, 8, 14, 5), dateOnly: false });
    expect(parseTimestamp('3/8/2026')).toMatchObject({ wall: wall(2026, 3, 8), dateOnly: true });
  });

  it('day-first reads the same text the other way, and every numeric date reports its two fields', () => {
    expect(parseTimestamp('13/06/2026 14:00', 'day-first')).toMatchObject({
      wall: wall(2026, 6, 13, 14),
      numericDate: { first: 13, second: 6 },
    });
    expect(parseTimestamp('08.06.2026', 'day-first')).toMatchObject({ wall: wall(2026, 6, 8), dateOnly: true });
    expect(parseTimestamp('8-6-26', 'day-first')).toMatchObject({ wall: wall(2026, 6, 8) });
    const refused = parseTimestamp('13/06/2026');
    expect(refused).toMatchObject({ ok: false, numericDate: { first: 13, second: 6 } });
    expect(!refused.ok && refused.message).toMatch(/read month-first/);
  });

  it('spreadsheet serial dates (1900 system): 45292 = 2024-01-01, 45292.5 = noon', () => {
    expect(parseTimestamp('45292')).toEqual({ ok: true, kind: 'wall', wall: wall(2024, 1, 1), dateOnly: true });
    expect(parseTimestamp('45292.5')).toEqual({ ok: true, kind: 'wall', wall: wall(2024, 1, 1, 12), dateOnly: false });
    expect(parseTimestamp('46335.041667')).toMatchObject({ wall: wall(2026, 11, 9, 1) });
  });

  it('T24:00 is the next midnight', () => {
    expect(parseTimestamp('2026-12-31T24:00')).toMatchObject({ wall: wall(2027, 1, 1) });
  });

  it.each([
    ['2026-02-30', /calendar date/],
    ['13/1/2026', /read month-first \(m\/d\/yyyy\)/],
    ['2026-11-01T25:00', /impossible time/],
    ['11/1/2026 13:00 PM', /AM\/PM/],
    ['123', /not a plausible spreadsheet date/],
    ['yesterday', /not a date\/time/],
    ['', /empty/],
  ])('rejects %j', (text, why) => {
    const result = parseTimestamp(text);
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toMatch(why);
  });
});

describe('spreadsheetSerialToWall', () => {
  it('absorbs float noise to the nearest second', () => {
    expect(spreadsheetSerialToWall(45292 + 1 / 24 - 1e-9)).toEqual(wall(2024, 1, 1, 1));
  });
});

describe('parseTimeOfDay', () => {
  it.each([
    ['14:00', 840, 0],
    ['2:00 PM', 840, 0],
    ['12:15 AM', 15, 0],
    ['06:30:45', 390, 45],
    ['24:00', 1440, 0],
    ['0.5', 720, 0],
  ])('%s → %d min %d s', (text, minutes, seconds) => {
    expect(parseTimeOfDay(text)).toEqual({ ok: true, minutes, seconds });
  });

  it.each(['25:00', '14:60', 'noon', '13:00 PM'])('rejects %j', (text) => {
    expect(parseTimeOfDay(text).ok).toBe(false);
  });
});

describe('combineDateAndTime', () => {
  it('joins a date column and a time column', () => {
    expect(combineDateAndTime('11/8/2026', '2:30 PM')).toEqual({
      ok: true,
      kind: 'wall',
      wall: wall(2026, 11, 8, 14, 30),
      dateOnly: false,
      numericDate: { first: 11, second: 8 },
    });
  });

  it('a time of 24:00 rolls to the next day', () => {
    expect(combineDateAndTime('2026-11-08', '24:00')).toMatchObject({ wall: wall(2026, 11, 9) });
  });

  it('refuses a date cell that already has a time', () => {
    const result = combineDateAndTime('2026-11-08 01:00', '02:00');
    expect(!result.ok && result.message).toMatch(/date only/);
  });
});
