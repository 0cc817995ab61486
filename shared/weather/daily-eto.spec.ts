import { describe, expect, it } from 'vitest';
import { computeDailyEto, type DailyWeatherObservation } from './daily-eto';
import { WeatherInputError } from './weather-input-error';

// Invented station and days; the published checks live in test/reference/fao56.test.ts.
const site = { latitudeDeg: 50.8, elevationM: 100 };
const temps: DailyWeatherObservation = { date: '2025-07-06', tMaxC: 21.5, tMinC: 12.3 };

function inputError(fn: () => unknown): WeatherInputError {
  try {
    fn();
  } catch (error) {
    expect(error).toBeInstanceOf(WeatherInputError);
    return error as WeatherInputError;
  }
  throw new Error('expected a WeatherInputError');
}

describe('computeDailyEto', () => {
  it('when only temperatures exist, then it falls back to Hargreaves', () => {
    const result = computeDailyEto(temps, site);
    expect(result.method).toBe('hargreaves');
    // Hand calculation, FAO-56 Eq. 52 with Ra = 41.088 MJ/m²/d: 0.0023 × (16.9 + 17.8) × √9.2 × 0.408 × 41.088 = 4.058.
    expect(result.etoMm).toBeCloseTo(4.058, 3);
    expect(result.notes.join(' ')).toMatch(/Hargreaves/);
  });

  it('when humidity exists but no radiation, then Rs is estimated and wind defaults to 2 m/s', () => {
    const result = computeDailyEto({ ...temps, rhMaxPct: 84, rhMinPct: 63 }, site);
    expect(result.method).toBe('penman-monteith-estimated-rs');
    expect(result.steps.windSpeed2mMs).toBe(2);
    expect(result.notes.some((n) => n.includes('wind at 2 m defaulted to 2 m/s'))).toBe(true);
    expect(result.notes.some((n) => n.includes('kRs 0.16'))).toBe(true);
    // kRs 0.16 × √9.2 × Ra: interior estimate.
    expect(result.steps.rsMj).toBeCloseTo(0.16 * Math.sqrt(9.2) * result.steps.raMj, 9);
  });

  it('when the site is coastal, then kRs is 0.19', () => {
    const result = computeDailyEto({ ...temps, rhMeanPct: 70 }, { ...site, exposure: 'coastal' });
    expect(result.steps.rsMj).toBeCloseTo(0.19 * Math.sqrt(9.2) * result.steps.raMj, 9);
  });

  it('when measured Rs is given, then the method is plain Penman–Monteith and Rs is used as is', () => {
    const result = computeDailyEto({ ...temps, solarRadiationMj: 20, windSpeedMs: 3 }, site);
    expect(result.method).toBe('penman-monteith');
    expect(result.steps.rsMj).toBe(20);
    expect(result.notes.some((n) => n.includes('dew point estimated as Tmin'))).toBe(true);
  });

  it('when dew point is given, then it sets ea over RH values', () => {
    const withDew = computeDailyEto({ ...temps, dewPointC: 10, rhMaxPct: 100, rhMinPct: 90 }, site);
    expect(withDew.steps.eaKpa).toBeCloseTo(0.6108 * Math.exp((17.27 * 10) / (10 + 237.3)), 9);
  });

  it('when wind at 2 m is below 0.5 m/s, then it is raised to 0.5 with a note', () => {
    const result = computeDailyEto({ ...temps, windSpeedMs: 0.1, rhMeanPct: 70 }, site);
    expect(result.steps.windSpeed2mMs).toBe(0.5);
    expect(result.notes.some((n) => n.includes('lower limit'))).toBe(true);
  });

  it('more wind on a dry day means more ETo', () => {
    const calm = computeDailyEto({ ...temps, rhMeanPct: 40, windSpeedMs: 1 }, site).etoMm;
    const windy = computeDailyEto({ ...temps, rhMeanPct: 40, windSpeedMs: 6 }, site).etoMm;
    expect(windy).toBeGreaterThan(calm);
  });

  it('when the latitude is beyond the polar circle in winter, then ETo is finite', () => {
    const result = computeDailyEto({ date: '2025-12-21', tMaxC: -10, tMinC: -20 }, { latitudeDeg: 80, elevationM: 0 });
    expect(Number.isFinite(result.etoMm)).toBe(true);
    expect(result.steps.raMj).toBe(0);
  });

  it('when Tmax is below Tmin, then it throws naming both', () => {
    const error = inputError(() => computeDailyEto({ ...temps, tMaxC: 10, tMinC: 12 }, site));
    expect(error.issues).toContainEqual({ field: 'tMaxC', message: 'Tmax 10 °C is below Tmin 12 °C' });
  });

  it('when several inputs are out of bounds, then every problem is listed', () => {
    const error = inputError(() =>
      computeDailyEto({ ...temps, rhMaxPct: 120, rhMinPct: -5, windSpeedMs: -1 }, { latitudeDeg: 95, elevationM: 100 }),
    );
    expect(error.issues.map((i) => i.field).sort()).toEqual(['latitudeDeg', 'rhMaxPct', 'rhMinPct', 'windSpeedMs']);
    expect(error.message).toContain('rhMaxPct: 120 % is outside 0..100 %');
  });

  it('when RHmin exceeds RHmax or dew point exceeds Tmax, then it throws', () => {
    expect(inputError(() => computeDailyEto({ ...temps, rhMaxPct: 50, rhMinPct: 60 }, site)).issues[0]!.field).toBe(
      'rhMinPct',
    );
    expect(inputError(() => computeDailyEto({ ...temps, dewPointC: 25 }, site)).issues[0]!.field).toBe('dewPointC');
  });

  it('when the date is missing or malformed, then it throws', () => {
    expect(inputError(() => computeDailyEto({ tMaxC: 20, tMinC: 10 }, site)).issues[0]!.field).toBe('date');
    expect(inputError(() => computeDailyEto({ date: '2025-02-30', tMaxC: 20, tMinC: 10 }, site)).message).toMatch(
      /that month has 28 days/,
    );
  });

  it('when measured Rs exceeds extraterrestrial radiation, then it throws', () => {
    const error = inputError(() =>
      computeDailyEto({ date: '2025-12-21', tMaxC: 5, tMinC: 0, solarRadiationMj: 30 }, site),
    );
    expect(error.issues[0]!.field).toBe('solarRadiationMj');
  });
});
