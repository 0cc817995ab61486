import { describe, expect, it } from 'vitest';
import {
  addWallMinutes,
  localDayHours,
  resolveLocalTime,
  resolveWallMs,
  resolveWallMsAfresh,
  zoneOffsetMinutes,
} from './zoned-time';

const at = (year: number, month: number, day: number, hour: number, minute = 0) => ({
  year,
  month,
  day,
  hour,
  minute,
  second: 0,
});
const LA = 'America/Los_Angeles';
const DEN = 'America/Denver';

describe('zoneOffsetMinutes', () => {
  it('PDT, PST, MDT, MST', () => {
    expect(zoneOffsetMinutes(Date.UTC(2026, 6, 1), LA)).toBe(-420);
    expect(zoneOffsetMinutes(Date.UTC(2026, 0, 1), LA)).toBe(-480);
    expect(zoneOffsetMinutes(Date.UTC(2026, 6, 1), DEN)).toBe(-360);
    expect(zoneOffsetMinutes(Date.UTC(2026, 0, 1), DEN)).toBe(-420);
  });
});

describe('resolveLocalTime', () => {
  it('an ordinary time has one instant', () => {
    expect(resolveLocalTime(at(2026, 7, 1, 12), LA)).toEqual({ kind: 'unique', utcMs: Date.UTC(2026, 6, 1, 19) });
  });

  it('fall-back 2026-11-01 01:30 in Los Angeles happens twice: PDT then PST', () => {
    expect(resolveLocalTime(at(2026, 11, 1, 1, 30), LA)).toEqual({
      kind: 'ambiguous',
      earlierUtcMs: Date.UTC(2026, 10, 1, 8, 30),
      laterUtcMs: Date.UTC(2026, 10, 1, 9, 30),
    });
  });

  it('fall-back 2026-11-01 01:00 in Denver happens twice: MDT then MST', () => {
    expect(resolveLocalTime(at(2026, 11, 1, 1), DEN)).toEqual({
      kind: 'ambiguous',
      earlierUtcMs: Date.UTC(2026, 10, 1, 7),
      laterUtcMs: Date.UTC(2026, 10, 1, 8),
    });
  });

  it('spring-forward 2026-03-08 02:00–02:59 does not exist in either zone', () => {
    expect(resolveLocalTime(at(2026, 3, 8, 2), LA)).toEqual({ kind: 'gap' });
    expect(resolveLocalTime(at(2026, 3, 8, 2, 59), DEN)).toEqual({ kind: 'gap' });
    expect(resolveLocalTime(at(2026, 3, 8, 3), DEN)).toEqual({ kind: 'unique', utcMs: Date.UTC(2026, 2, 8, 9) });
    expect(resolveLocalTime(at(2026, 3, 8, 1, 59), LA)).toEqual({ kind: 'unique', utcMs: Date.UTC(2026, 2, 8, 9, 59) });
  });

  it('a zone without DST never has gaps or folds', () => {
    expect(resolveLocalTime(at(2026, 3, 8, 2, 30), 'America/Phoenix')).toEqual({
      kind: 'unique',
      utcMs: Date.UTC(2026, 2, 8, 9, 30),
    });
  });
});

describe('localDayHours', () => {
  it('23, 24 and 25 hours', () => {
    expect(localDayHours(2026, 3, 8, LA)).toBe(23);
    expect(localDayHours(2026, 3, 9, LA)).toBe(24);
    expect(localDayHours(2026, 11, 1, DEN)).toBe(25);
    expect(localDayHours(2026, 11, 1, 'UTC')).toBe(24);
  });
});

describe('addWallMinutes', () => {
  it('moves along clock labels across month ends', () => {
    expect(addWallMinutes(at(2026, 10, 31, 23, 45), 30)).toEqual(at(2026, 11, 1, 0, 15));
  });
});

describe('remembered steady wall hours', () => {
  // Zones with 1 h and 30 min DST shifts, half-hour and 45-minute offsets, no DST, and a southern-hemisphere one.
  const zones = [
    LA,
    DEN,
    'America/Phoenix',
    'Europe/London',
    'Australia/Lord_Howe',
    'Asia/Kolkata',
    'Pacific/Chatham',
    'America/Santiago',
    'Asia/Tehran',
  ];
  it.each(zones)('every quarter hour of 2025–2026 in %s resolves as when worked out afresh', (zone) => {
    for (let ms = Date.UTC(2025, 0, 1); ms < Date.UTC(2027, 0, 1); ms += 15 * 60_000) {
      const expected = resolveWallMsAfresh(ms, zone);
      const got = resolveWallMs(ms, zone);
      if (got.kind !== expected.kind || JSON.stringify(got) !== JSON.stringify(expected)) {
        expect({ wall: new Date(ms).toISOString(), got }).toEqual({ wall: new Date(ms).toISOString(), got: expected });
      }
    }
  });
});
