/**
 * Checks for the ASCE-EWRI (2005) standardized reference ET constants. docs/references.md §2: the report text was not
 * available, so the constants are "from memory (matches third-party code)" and cited as "ASCE-EWRI p.21".
 * No ASCE worked example is available; the daily short reference is checked against FAO-56 Example 18, which
 * uses the same equation and constants.
 */
import { describe, expect, it } from 'vitest';
import { computeDailyEto } from '../../shared/weather/daily-eto';
import { computeHourlyEto } from '../../shared/weather/hourly-eto';
import { ASCE_STANDARDIZED, FAO56_DAILY, penmanMonteith } from '../../shared/weather/penman-monteith';
import { expectPrinted } from './printed-rounding';

describe('ASCE-EWRI standardized constants', () => {
  it('daily Cn/Cd: short 900/0.34, tall 1600/0.38', () => {
    expect(ASCE_STANDARDIZED.daily.short).toEqual({ cn: 900, cd: 0.34 }); // ASCE-EWRI p.21 Table (from memory)
    expect(ASCE_STANDARDIZED.daily.tall).toEqual({ cn: 1600, cd: 0.38 }); // ASCE-EWRI p.21 Table (from memory)
  });

  it('hourly Cn/Cd by day and by night', () => {
    expect(ASCE_STANDARDIZED.hourlyDay.short).toEqual({ cn: 37, cd: 0.24 }); // ASCE-EWRI p.21 Table (from memory)
    expect(ASCE_STANDARDIZED.hourlyDay.tall).toEqual({ cn: 66, cd: 0.25 }); // ASCE-EWRI p.21 Table (from memory)
    expect(ASCE_STANDARDIZED.hourlyNight.short).toEqual({ cn: 37, cd: 0.96 }); // ASCE-EWRI p.21 Table (from memory)
    expect(ASCE_STANDARDIZED.hourlyNight.tall).toEqual({ cn: 66, cd: 1.7 }); // ASCE-EWRI p.21 Table (from memory)
  });

  it('hourly soil heat flux fractions', () => {
    expect(ASCE_STANDARDIZED.hourlySoilHeatFraction.short).toEqual({ day: 0.1, night: 0.5 }); // ASCE-EWRI (from memory)
    expect(ASCE_STANDARDIZED.hourlySoilHeatFraction.tall).toEqual({ day: 0.04, night: 0.2 }); // ASCE-EWRI (from memory)
  });

  it('the daily short reference is FAO-56 Eq. 6', () => {
    expect(ASCE_STANDARDIZED.daily.short).toEqual(FAO56_DAILY); // ASCE-EWRI (from memory); FAO-56 Eq. 6, p.65
  });
});

describe('ASCE daily ETos on FAO-56 Example 18 (Uccle, 6 July)', () => {
  const fao = computeDailyEto(
    {
      date: '2025-07-06',
      tMaxC: 21.5,
      tMinC: 12.3,
      rhMaxPct: 84,
      rhMinPct: 63,
      windSpeedMs: 10 / 3.6,
      windHeightM: 10,
      sunshineHours: 9.25,
    },
    { latitudeDeg: 50.8, elevationM: 100 },
  );
  const s = fao.steps;
  const inputs = {
    slopeKpaPerC: s.slopeKpaPerC!,
    psychrometricKpaPerC: s.psychrometricKpaPerC!,
    netRadiationMj: s.rnMj!,
    soilHeatFluxMj: 0,
    meanTempC: s.meanTempC,
    windSpeed2mMs: s.windSpeed2mMs!,
    esKpa: s.esKpa!,
    eaKpa: s.eaKpa!,
  };

  it('ETos equals 3.88 mm/d', () => {
    expectPrinted(penmanMonteith(inputs, ASCE_STANDARDIZED.daily.short).etMm, 3.88, 2); // FAO-56 Example 18, p.72–73
  });

  it('the tall reference (alfalfa) uses more water than the short reference on the same day', () => {
    // Physical expectation, not a published value: a taller, rougher crop exchanges more vapour.
    expect(penmanMonteith(inputs, ASCE_STANDARDIZED.daily.tall).etMm).toBeGreaterThan(3.88);
  });
});

describe('ASCE hourly differs from FAO-56 hourly (docs/references.md §2 note)', () => {
  // Inputs of FAO-56 Example 19, p.75–76 (N'Diaye, 1 October).
  const site = { latitudeDeg: 16 + 13 / 60, longitudeDegEast: -16.25, timeZoneMeridianDegEast: -15, elevationM: 8 };
  const dayObs = {
    dayOfYear: 274,
    clockHourMidpoint: 14.5,
    tempC: 38,
    rhPct: 52,
    windSpeedMs: 3.3,
    solarRadiationMj: 2.45,
  };
  const nightObs = {
    dayOfYear: 274,
    clockHourMidpoint: 2.5,
    tempC: 28,
    rhPct: 90,
    windSpeedMs: 1.9,
    solarRadiationMj: 0,
  };

  it('by day ASCE (Cd 0.24) gives more than FAO (Cd 0.34); at night (Cd 0.96) less', () => {
    expect(computeHourlyEto(dayObs, site, 'asce-short').etoMm).toBeGreaterThan(
      computeHourlyEto(dayObs, site, 'fao56').etoMm,
    );
    expect(computeHourlyEto(nightObs, site, 'asce-short').etoMm).toBeLessThan(
      computeHourlyEto(nightObs, site, 'fao56').etoMm,
    );
  });

  it("by day ASCE short with G = 0.1Rn reproduces the FAO radiation term when Cd is set to FAO's value", () => {
    // Same Rn and G (0.1Rn) by day, so only the denominator constant differs: check the ratio of the two results.
    const asce = computeHourlyEto(dayObs, site, 'asce-short');
    const fao = computeHourlyEto(dayObs, site, 'fao56');
    const s = fao.steps;
    const denomFao = s.slopeKpaPerC + s.psychrometricKpaPerC * (1 + 0.34 * s.windSpeed2mMs);
    const denomAsce = s.slopeKpaPerC + s.psychrometricKpaPerC * (1 + 0.24 * s.windSpeed2mMs);
    expect(asce.etoMm * denomAsce).toBeCloseTo(fao.etoMm * denomFao, 10);
  });
});
