import { describe, expect, it } from 'vitest';
import { detectLongRuns } from './runaway-zone-detection';
import { HOUR_MS } from './site-clock';
import { run, T0, testContext, testZones } from './watch-test-input';

const DAY = 24 * HOUR_MS;

/** Nightly program A, B, C back to back from 22:00 with the given minutes. */
function program(d: number, a: number, b: number, c: number) {
  const s = T0 + d * DAY + 22 * HOUR_MS;
  return [run('A', s, a), run('B', s + a * 60_000, b), run('C', s + (a + b) * 60_000, c)];
}

describe('detectLongRuns', () => {
  it('flags a zone running far longer than its recent runs', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10 + (d % 2), 15, 20)).flat(),
      ...program(12, 40, 15, 20),
    ];
    const [f, ...rest] = detectLongRuns(runs, testContext());
    expect(rest).toEqual([]);
    expect(f).toMatchObject({ subKind: 'long-run', zoneId: 'A', ongoing: true });
    expect(f!.evidence['longestMinutes']).toBe(40);
    // Usual run is the median of 10, 11, 10, 11, … = 10.5; 29.5 extra minutes × 10 gpm.
    expect(f!.evidence['usualMinutes']).toBe(10.5);
    expect(f!.waterLostGal).toBeCloseTo(295, 6);
  });

  it('names the zone as people know it (station and name) when the label is known', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10 + (d % 2), 15, 20)).flat(),
      ...program(12, 40, 15, 20),
    ];
    const zones = testZones.map((z) => (z.zoneId === 'A' ? { ...z, label: 'Station 1 “Front lawn”' } : z));
    const [f] = detectLongRuns(runs, testContext({}, {}, zones));
    expect(f!.explanation).toMatch(/^Station 1 “Front lawn” ran up to 40 minutes/);
    expect(f!.series[0]!.label).toBe('Station 1 “Front lawn” run length, minutes');
  });

  it('does not flag the whole program growing together (a hot week or a raised seasonal %)', () => {
    const runs = [...Array.from({ length: 12 }, (_, d) => program(d, 10, 15, 20)).flat(), ...program(12, 17, 26, 34)];
    expect(detectLongRuns(runs, testContext())).toEqual([]);
  });

  it('ignores manual and skipped runs, and waits for enough history', () => {
    const runs = [
      ...Array.from({ length: 12 }, (_, d) => program(d, 10, 15, 20)).flat(),
      run('A', T0 + 12 * DAY + 14 * HOUR_MS, 60, { cause: 'manual' }),
      run('A', T0 + 13 * DAY + 22 * HOUR_MS, 60, { cause: 'skipped-rain' }),
    ];
    expect(detectLongRuns(runs, testContext())).toEqual([]);
    expect(detectLongRuns([...program(0, 10, 15, 20), ...program(1, 40, 15, 20)], testContext())).toEqual([]);
  });

  it('compares with the programmed minutes when they are known', () => {
    const zones = [{ zoneId: 'A', designGpm: 10, scheduledMinutes: 10 }];
    const findings = detectLongRuns([run('A', T0, 16)], testContext({}, {}, zones));
    expect(findings).toHaveLength(1);
    expect(findings[0]!.evidence['usualMinutes']).toBe(10);
  });
});
