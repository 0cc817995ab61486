import { describe, expect, it } from 'vitest';
import { answer } from './fake-weather-server';

const ask = (query: string) => answer(new URL(`http://feed.invalid/daily-observations?${query}`));

describe('fake weather feed', () => {
  it('when the same point and dates are asked twice, then the answers are identical', () => {
    expect(ask('lat=36.9&lon=-120.4&from=2025-01-01&to=2025-03-31')).toEqual(
      ask('lat=36.9&lon=-120.4&from=2025-01-01&to=2025-03-31'),
    );
  });

  it('when a northern point is asked for January and July, then July is warmer and sunnier', () => {
    const mean = (from: string, to: string, key: 'tempHighC' | 'solarMj') => {
      const days = (ask(`lat=36.9&lon=-120.4&from=${from}&to=${to}`).body as { days: Record<string, number>[] }).days;
      return days.reduce((s, d) => s + d[key]!, 0) / days.length;
    };
    expect(mean('2025-07-01', '2025-07-31', 'tempHighC')).toBeGreaterThan(
      mean('2025-01-01', '2025-01-31', 'tempHighC') + 10,
    );
    expect(mean('2025-07-01', '2025-07-31', 'solarMj')).toBeGreaterThan(mean('2025-01-01', '2025-01-31', 'solarMj'));
  });

  it('when the request is malformed, then 400 with a problem sentence', () => {
    expect(ask('lat=95&lon=0&from=2025-01-01&to=2025-01-02')).toMatchObject({
      status: 400,
      body: { problem: expect.stringMatching(/lat/) },
    });
    expect(ask('lat=10&lon=0&from=2025-01-01&to=2027-06-01')).toMatchObject({ status: 400 });
    expect(ask('lat=10&lon=0&from=2025-02-30&to=2025-03-01')).toMatchObject({ status: 400 });
  });
});
