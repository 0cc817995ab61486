import { describe, expect, it } from 'vitest';
import { planSiteCheck } from './site-check-plan';
import { LOOK_BACK_MS } from './site-watch-input';

const H = 3_600_000;
const LA = 'America/Los_Angeles';
// 2026-07-15 11:30 UTC is 04:30 in Los Angeles (PDT), 21:30 in Sydney.
const asOf = new Date(Date.UTC(2026, 6, 15, 11, 30));
const state = (lastDataH: number, lastNight: string | null = null) => ({
  lastDataUtc: new Date(asOf.getTime() - lastDataH * H),
  lastCheckedAsOfUtc: new Date(asOf.getTime() - 24 * H),
  lastNight,
});

describe('planSiteCheck', () => {
  it(
    'when a site has data newer than its last check, then it is read ' + 'from the look-back before the first new hour',
    () => {
      const plan = planSiteCheck({
        trigger: 'manual',
        timeZone: LA,
        state: state(25),
        latest: new Date(asOf.getTime() - H),
        asOf: asOf,
        localHour: 4,
      });
      expect(plan).toEqual({ fromUtc: new Date(asOf.getTime() - 25 * H - LOOK_BACK_MS), night: null });
    },
  );

  it('when nothing new arrived and the silence is not news, then the site is skipped', () => {
    expect(
      planSiteCheck({
        trigger: 'manual',
        timeZone: LA,
        state: state(2),
        latest: new Date(asOf.getTime() - 2 * H),
        asOf: asOf,
        localHour: 4,
      }),
    ).toBeNull();
  });

  it('when a meter has just been silent for longer than the silent-meter threshold, then it is checked once', () => {
    const latest = new Date(asOf.getTime() - 50 * H);
    expect(
      planSiteCheck({
        trigger: 'manual',
        timeZone: LA,
        state: { ...state(50), lastCheckedAsOfUtc: new Date(asOf.getTime() - 24 * H) },
        latest: latest,
        asOf: asOf,
        localHour: 4,
      }),
    ).not.toBeNull();
    expect(
      planSiteCheck({
        trigger: 'manual',
        timeZone: LA,
        state: { ...state(50), lastCheckedAsOfUtc: new Date(asOf.getTime() - H) },
        latest: latest,
        asOf: asOf,
        localHour: 4,
      }),
    ).toBeNull();
  });

  it(
    'when the schedule ticks, then only sites whose local clock passed ' + '04:00 and whose night is unchecked are due',
    () => {
      const latest = new Date(asOf.getTime() - H);
      expect(
        planSiteCheck({
          trigger: 'scheduled',
          timeZone: LA,
          state: state(25),
          latest: latest,
          asOf: asOf,
          localHour: 4,
        })?.night,
      ).toBe('2026-07-15');
      expect(
        planSiteCheck({
          trigger: 'scheduled',
          timeZone: LA,
          state: state(25, '2026-07-15'),
          latest: latest,
          asOf: asOf,
          localHour: 4,
        }),
      ).toBeNull();
      expect(
        planSiteCheck({
          trigger: 'scheduled',
          timeZone: 'Australia/Sydney',
          state: state(25),
          latest: latest,
          asOf: asOf,
          localHour: 4,
        })?.night,
      ).toBe('2026-07-15');
      // 01:30 there
      expect(
        planSiteCheck({
          trigger: 'scheduled',
          timeZone: 'Pacific/Honolulu',
          state: state(25),
          latest: latest,
          asOf: asOf,
          localHour: 4,
        }),
      ).toBeNull();
    },
  );

  it('when a range is re-checked, then it is read whatever was checked before', () => {
    const from = new Date(Date.UTC(2026, 0, 1));
    expect(
      planSiteCheck({
        trigger: 'recheck',
        rangeFrom: from,
        timeZone: LA,
        state: state(1),
        latest: null,
        asOf: asOf,
        localHour: 4,
      }),
    ).toEqual({
      fromUtc: new Date(from.getTime() - LOOK_BACK_MS),
      night: null,
    });
  });
});
