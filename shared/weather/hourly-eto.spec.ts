import { describe, expect, it } from 'vitest';
import { computeHourlyEto } from './hourly-eto';
import { WeatherInputError } from './weather-input-error';

// Invented Californian station (Pacific standard time, meridian −120°).
const site = { latitudeDeg: 36.8, longitudeDegEast: -119.7, timeZoneMeridianDegEast: -120, elevationM: 100 };

describe('computeHourlyEto', () => {
  it('when the sun is up, then Ra is positive and the period counts as day', () => {
    const noon = computeHourlyEto(
      { dayOfYear: 180, clockHourMidpoint: 12.5, tempC: 32, rhPct: 30, windSpeedMs: 2.5, solarRadiationMj: 3.2 },
      site,
    );
    expect(noon.steps.raMj).toBeGreaterThan(0);
    expect(noon.isDaytime).toBe(true);
    expect(noon.etoMm).toBeGreaterThan(0.3);
  });

  it('tall reference by day exceeds short reference', () => {
    const obs = {
      dayOfYear: 180,
      clockHourMidpoint: 13.5,
      tempC: 33,
      rhPct: 25,
      windSpeedMs: 3,
      solarRadiationMj: 3.1,
    };
    expect(computeHourlyEto(obs, site, 'asce-tall').etoMm).toBeGreaterThan(
      computeHourlyEto(obs, site, 'asce-short').etoMm,
    );
  });

  it('when RH is above 100 %, then it throws', () => {
    expect(() =>
      computeHourlyEto({ dayOfYear: 180, clockHourMidpoint: 12.5, tempC: 20, rhPct: 101, windSpeedMs: 1 }, site),
    ).toThrow(WeatherInputError);
  });
});
