/**
 * Checks against FAO Irrigation and Drainage Paper 56 (Allen, Pereira, Raes, Smith 1998), worked examples of
 * Chapter 3/4 and Annex 2 tables, as transcribed in docs/references.md §1. Each value is compared at its printed
 * rounding (docs/references.md, "Tolerances").
 */
import { describe, expect, it } from 'vitest';
import {
  actualVapourPressureFromPsychrometer,
  actualVapourPressureFromRhExtremes,
  actualVapourPressureFromRhMean,
} from '../../shared/weather/actual-vapour-pressure';
import {
  atmosphericPressureKpa,
  meanSaturationVapourPressureKpa,
  psychrometricConstantKpaPerC,
  saturationVapourPressureKpa,
  vapourPressureSlopeKpaPerC,
} from '../../shared/weather/atmosphere';
import { computeDailyEto } from '../../shared/weather/daily-eto';
import { dayOfYear } from '../../shared/weather/day-of-year';
import { computeHourlyEto } from '../../shared/weather/hourly-eto';
import {
  KELVIN_OFFSET_FAO,
  blackbodyRadiationMj,
  clearSkyRadiationMj,
  netLongwaveRadiation,
  netRadiationMj,
  netShortwaveRadiationMj,
  solarRadiationFromSunshineMj,
} from '../../shared/weather/net-radiation';
import {
  SOLAR_CONSTANT_MJ_PER_M2_MIN,
  degreesToRadians,
  daylightHours,
  extraterrestrialRadiationDailyMj,
  inverseRelativeDistance,
  latitudeRadians,
  seasonalCorrectionHours,
  solarDeclinationRad,
  sunsetHourAngleRad,
} from '../../shared/weather/solar-geometry';
import { monthlySoilHeatFluxMj, windFactorTo2m, windSpeedAt2m } from '../../shared/weather/wind-and-soil-heat';
import { expectPrinted } from './printed-rounding';

describe('FAO-56 constants', () => {
  it('Box 9 constant 24·60/π·Gsc is 37.59', () => {
    expectPrinted(((24 * 60) / Math.PI) * SOLAR_CONSTANT_MJ_PER_M2_MIN, 37.59, 2); // FAO-56 Box 9, p.49
  });
});

describe('FAO-56 small worked examples (Ch. 3)', () => {
  it('Example 2: P and γ at 1800 m', () => {
    const p = atmosphericPressureKpa(1800);
    expectPrinted(p, 81.8, 1); // FAO-56 Example 2, p.32
    expectPrinted(psychrometricConstantKpaPerC(p), 0.054, 3); // FAO-56 Example 2, p.32
  });

  it('Example 3: e° at Tmax 24.5 and Tmin 15, es, and e°(Tmean)', () => {
    expectPrinted(saturationVapourPressureKpa(24.5), 3.075, 3); // FAO-56 Example 3, p.36
    expectPrinted(saturationVapourPressureKpa(15), 1.705, 3); // FAO-56 Example 3, p.36
    expectPrinted(meanSaturationVapourPressureKpa(24.5, 15), 2.39, 2); // FAO-56 Example 3, p.36
    expectPrinted(saturationVapourPressureKpa(19.75), 2.3, 2); // FAO-56 Example 3, p.36 (e° at Tmean underestimates es)
  });

  it('Example 4: ea from an aspirated psychrometer at 1200 m', () => {
    const p = atmosphericPressureKpa(1200);
    expectPrinted(p, 87.9, 1); // FAO-56 Example 4, p.38
    expectPrinted(saturationVapourPressureKpa(19.5), 2.267, 3); // FAO-56 Example 4, p.38
    expectPrinted(actualVapourPressureFromPsychrometer(25.6, 19.5, p, 0.000662), 1.91, 2); // FAO-56 Example 4, p.38
  });

  it('Examples 5 and 6: ea from RHmax/RHmin, from RHmean, and the vapour pressure deficit', () => {
    expectPrinted(saturationVapourPressureKpa(18), 2.064, 3); // FAO-56 Example 5, p.39
    expectPrinted(saturationVapourPressureKpa(25), 3.168, 3); // FAO-56 Example 5, p.39
    const ea = actualVapourPressureFromRhExtremes(25, 18, 82, 54);
    expectPrinted(ea, 1.7, 2); // FAO-56 Example 5, p.39
    expectPrinted(actualVapourPressureFromRhMean(25, 18, (82 + 54) / 2), 1.78, 2); // FAO-56 Example 5, p.39 (Eq. 19)
    expectPrinted(meanSaturationVapourPressureKpa(25, 18) - ea, 0.91, 2); // FAO-56 Example 6, p.39
  });

  it('Example 7: latitudes of Bangkok and Rio de Janeiro in radians', () => {
    expectPrinted(latitudeRadians(13, 44, 'N'), 0.24, 3); // FAO-56 Example 7, p.46 (+0.240)
    expectPrinted(latitudeRadians(22, 54, 'S'), -0.4, 3); // FAO-56 Example 7, p.46 (−0.400)
  });

  it('Examples 8 and 9: Ra and N on 3 September at 20°S', () => {
    const j = dayOfYear(2025, 9, 3);
    expect(j).toBe(246); // FAO-56 Example 8, p.47
    const phi = -0.35; // FAO-56 Example 8 uses φ = −0.35 rad for 20°S
    const delta = solarDeclinationRad(j);
    expectPrinted(inverseRelativeDistance(j), 0.985, 3); // FAO-56 Example 8, p.47
    expectPrinted(delta, 0.12, 3); // FAO-56 Example 8, p.47 (0.120)
    expectPrinted(sunsetHourAngleRad(phi, delta), 1.527, 3); // FAO-56 Example 8, p.47
    expectPrinted(Math.sin(phi) * Math.sin(delta), -0.041, 3); // FAO-56 Example 8, p.47
    expectPrinted(Math.cos(phi) * Math.cos(delta), 0.933, 3); // FAO-56 Example 8, p.47
    const ra = extraterrestrialRadiationDailyMj(phi, j);
    expectPrinted(ra, 32.2, 1); // FAO-56 Example 8, p.47
    expectPrinted(ra * 0.408, 13.1, 1); // FAO-56 Example 8, p.47 (13.1 mm/d)
    expectPrinted(daylightHours(phi, j), 11.7, 1); // FAO-56 Example 9, p.49
  });

  // Rio de Janeiro (22°54'S) in May: 220 h of bright sunshine over 31 days, J = 135, sea level.
  const rio = { phi: latitudeRadians(22, 54, 'S'), j: 135, n: 220 / 31 };

  it('Example 10: Rs from sunshine hours, Rio de Janeiro in May', () => {
    const ra = extraterrestrialRadiationDailyMj(rio.phi, rio.j);
    const n = daylightHours(rio.phi, rio.j);
    expectPrinted(ra, 25.1, 1); // FAO-56 Example 10, p.50
    expectPrinted(n, 10.9, 1); // FAO-56 Example 10, p.50
    expectPrinted(rio.n, 7.1, 1); // FAO-56 Example 10, p.50
    const rs = solarRadiationFromSunshineMj(ra, rio.n, n);
    expectPrinted(rs, 14.5, 1); // FAO-56 Example 10, p.50
    expectPrinted(rs * 0.408, 5.9, 1); // FAO-56 Example 10, p.50 (5.9 mm/d)
  });

  it('Examples 11 and 12: Rnl, Rns and Rn for the same month', () => {
    const ra = extraterrestrialRadiationDailyMj(rio.phi, rio.j);
    const rs = solarRadiationFromSunshineMj(ra, rio.n, daylightHours(rio.phi, rio.j));
    const rso = clearSkyRadiationMj(ra, 0);
    expectPrinted(rso, 18.8, 1); // FAO-56 Example 11, p.52
    expectPrinted(blackbodyRadiationMj(25.1), 38.8, 1); // FAO-56 Example 11, p.52
    expectPrinted(blackbodyRadiationMj(19.1), 35.8, 1); // FAO-56 Example 11, p.52
    const rnl = netLongwaveRadiation(25.1, 19.1, 2.1, rs / rso).rnlMj;
    expectPrinted(rnl, 3.5, 1); // FAO-56 Example 11, p.52
    const rns = netShortwaveRadiationMj(rs);
    expectPrinted(rns, 11.1, 1); // FAO-56 Example 12, p.53
    expectPrinted(netRadiationMj(rns, rnl), 7.6, 1); // FAO-56 Example 12, p.53
  });

  it('Example 13: monthly soil heat flux in Algiers (Mar 14.1, Apr 16.1, May 18.8 °C)', () => {
    const g = monthlySoilHeatFluxMj(14.1, 16.1, 18.8);
    expectPrinted(g, 0.33, 2); // FAO-56 Example 13, p.55
    expectPrinted(g * 0.408, 0.13, 2); // FAO-56 Example 13, p.55 (0.13 mm/d)
  });

  it('Example 14: wind of 3.2 m/s at 10 m brought to 2 m', () => {
    expectPrinted(windFactorTo2m(10), 0.75, 2); // FAO-56 Example 14, p.56
    expectPrinted(windSpeedAt2m(3.2, 10), 2.4, 1); // FAO-56 Example 14, p.56
  });
});

describe('FAO-56 Example 18: daily ETo at Uccle (Brussels) on 6 July, p.72–73', () => {
  const result = computeDailyEto(
    {
      date: '2025-07-06',
      tMaxC: 21.5,
      tMinC: 12.3,
      rhMaxPct: 84,
      rhMinPct: 63,
      windSpeedMs: 10 / 3.6, // 10 km/h
      windHeightM: 10,
      sunshineHours: 9.25,
    },
    { latitudeDeg: 50.8, elevationM: 100 },
  );
  const s = result.steps;

  it('uses Penman–Monteith with sunshine-derived Rs and J = 187', () => {
    expect(result.method).toBe('penman-monteith');
    expect(s.dayOfYear).toBe(187); // FAO-56 Example 18, p.72–73
  });

  it('reproduces the published intermediate values', () => {
    expectPrinted(s.windSpeed2mMs!, 2.078, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.pressureKpa!, 100.1, 1); // FAO-56 Example 18, p.72–73
    expectPrinted(s.meanTempC, 16.9, 1); // FAO-56 Example 18, p.72–73
    expectPrinted(s.slopeKpaPerC!, 0.122, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.psychrometricKpaPerC!, 0.0666, 4); // FAO-56 Example 18, p.72–73
    const u2 = s.windSpeed2mMs!;
    const denominator = s.slopeKpaPerC! + s.psychrometricKpaPerC! * (1 + 0.34 * u2);
    expectPrinted(1 + 0.34 * u2, 1.71, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.slopeKpaPerC! / denominator, 0.518, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.psychrometricKpaPerC! / denominator, 0.282, 3); // FAO-56 Example 18, p.72–73
    expectPrinted((900 * u2) / (s.meanTempC + 273), 6.45, 3); // FAO-56 Example 18, p.72–73 (6.450)
    expectPrinted(saturationVapourPressureKpa(21.5), 2.564, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(saturationVapourPressureKpa(12.3), 1.431, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.esKpa!, 1.997, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.eaKpa!, 1.409, 3); // FAO-56 Example 18, p.72–73 (Eq. 17)
    expectPrinted(s.esKpa! - s.eaKpa!, 0.589, 3); // FAO-56 Example 18, p.72–73
    expectPrinted(s.raMj, 41.09, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.daylightHours!, 16.1, 1); // FAO-56 Example 18, p.72–73
    expectPrinted(9.25 / s.daylightHours!, 0.57, 2); // FAO-56 Example 18, p.72–73 (text prints "9.25/16.3", a typo)
    expectPrinted(s.rsMj!, 22.07, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.rsoMj!, 30.9, 2); // FAO-56 Example 18, p.72–73 (30.90)
    expectPrinted(s.rsMj! / s.rsoMj!, 0.71, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.rnsMj!, 17.0, 2); // FAO-56 Example 18, p.72–73 (17.00)
    expectPrinted(21.5 + KELVIN_OFFSET_FAO, 294.7, 1); // FAO-56 Example 18, p.72–73 (Tmax,K)
    expectPrinted(12.3 + KELVIN_OFFSET_FAO, 285.5, 1); // FAO-56 Example 18, p.72–73 (Tmin,K)
    const rnl = netLongwaveRadiation(21.5, 12.3, s.eaKpa!, s.rsMj! / s.rsoMj!);
    expectPrinted(blackbodyRadiationMj(21.5), 36.96, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(blackbodyRadiationMj(12.3), 32.56, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(rnl.blackbodyMj, 34.76, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(rnl.humidityFactor, 0.17, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(rnl.cloudinessFactor, 0.61, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.rnlMj!, 3.71, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.rnMj!, 13.28, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(0.408 * s.rnMj!, 5.42, 2); // FAO-56 Example 18, p.72–73 (G = 0)
    expectPrinted(s.radiationTermMm!, 2.81, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(s.aerodynamicTermMm!, 1.07, 2); // FAO-56 Example 18, p.72–73
  });

  it('gives ETo 3.88 mm/d (≈ 3.9)', () => {
    expectPrinted(result.etoMm, 3.88, 2); // FAO-56 Example 18, p.72–73
    expectPrinted(result.etoMm, 3.9, 1); // FAO-56 Example 18, p.72–73 ("≈ 3.9 mm/day")
  });

  it('matches the full-precision chain redone from the raw inputs', () => {
    // docs/references.md §1, Example 18 "published + derived": arithmetic redone at full precision.
    expectPrinted(s.windSpeed2mMs!, 2.0776, 4);
    expectPrinted(s.raMj, 41.088, 3);
    expectPrinted(s.daylightHours!, 16.105, 3);
    expectPrinted(s.rsMj!, 22.072, 3);
    expectPrinted(s.rnlMj!, 3.712, 3);
    expectPrinted(s.rnMj!, 13.283, 3);
    expectPrinted(result.etoMm, 3.8803, 4);
  });
});

describe("FAO-56 Example 19: hourly ETo at N'Diaye (Senegal) on 1 October, p.75–76", () => {
  // 16°13'N, 16°15'W; FAO's Lz = 15°W and Lm = 16.25°W become −15 and −16.25 degrees east.
  const site = { latitudeDeg: 16 + 13 / 60, longitudeDegEast: -16.25, timeZoneMeridianDegEast: -15, elevationM: 8 };
  const night = computeHourlyEto(
    {
      dayOfYear: 274,
      clockHourMidpoint: 2.5,
      tempC: 28,
      rhPct: 90,
      windSpeedMs: 1.9,
      solarRadiationMj: 0,
      rsOverRsoWhenDark: 0.8,
    },
    site,
    'fao56',
  );
  const day = computeHourlyEto(
    { dayOfYear: 274, clockHourMidpoint: 14.5, tempC: 38, rhPct: 52, windSpeedMs: 3.3, solarRadiationMj: 2.45 },
    site,
    'fao56',
  );

  it('shared geometry: φ, dr, δ, Sc', () => {
    expect(dayOfYear(2025, 10, 1)).toBe(274); // FAO-56 Example 19, p.75–76
    expectPrinted(degreesToRadians(site.latitudeDeg), 0.283, 4); // FAO-56 Example 19, p.75–76 (0.2830)
    expectPrinted(inverseRelativeDistance(274), 1.0001, 4); // FAO-56 Example 19, p.75–76
    expectPrinted(solarDeclinationRad(274), -0.0753, 4); // FAO-56 Example 19, p.75–76
    expectPrinted(seasonalCorrectionHours(274), 0.1889, 4); // FAO-56 Example 19, p.75–76
  });

  it('02–03 h: night values', () => {
    const s = night.steps;
    expect(night.isDaytime).toBe(false);
    expectPrinted(s.slopeKpaPerC, 0.22, 3); // FAO-56 Example 19, p.75–76 (0.220)
    expectPrinted(s.psychrometricKpaPerC, 0.0673, 4); // FAO-56 Example 19, p.75–76
    expectPrinted(s.esKpa, 3.78, 3); // FAO-56 Example 19, p.75–76 (3.780)
    expectPrinted(s.eaKpa, 3.402, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.esKpa - s.eaKpa, 0.378, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.omegaRad, -2.46, 2); // FAO-56 Example 19, p.75–76
    expect(s.raMj).toBe(0); // FAO-56 Example 19, p.75–76 (sun below the horizon)
    expect(s.rsoMj).toBe(0); // FAO-56 Example 19, p.75–76
    expectPrinted(s.blackbodyMj, 1.681, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.humidityFactor, 0.082, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.cloudinessFactor, 0.73, 3); // FAO-56 Example 19, p.75–76 (0.730, from the assumed Rs/Rso 0.8)
    expectPrinted(s.rnlMj, 0.1, 3); // FAO-56 Example 19, p.75–76 (0.100)
    expectPrinted(s.rnMj, -0.1, 3); // FAO-56 Example 19, p.75–76 (−0.100)
    expectPrinted(s.soilHeatFluxMj, -0.05, 3); // FAO-56 Example 19, p.75–76 (−0.050)
    expectPrinted(0.408 * (s.rnMj - s.soilHeatFluxMj), -0.02, 3); // FAO-56 Example 19, p.75–76 (−0.020)
    expectPrinted(s.radiationTermMm, -0.01, 2); // FAO-56 Example 19, p.75–76
    expectPrinted(night.etoMm, 0.0, 2); // FAO-56 Example 19, p.75–76 (0.00 mm/h)
  });

  it('14–15 h: day values', () => {
    const s = day.steps;
    expect(day.isDaytime).toBe(true);
    expectPrinted(s.slopeKpaPerC, 0.358, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.esKpa, 6.625, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.eaKpa, 3.445, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.esKpa - s.eaKpa, 3.18, 3); // FAO-56 Example 19, p.75–76 (3.180)
    expectPrinted(s.omegaRad, 0.682, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.omega1Rad, 0.5512, 4); // FAO-56 Example 19, p.75–76
    expectPrinted(s.omega2Rad, 0.813, 4); // FAO-56 Example 19, p.75–76 (0.8130)
    expectPrinted(s.raMj, 3.543, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.rsoMj, 2.658, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.rnsMj, 1.887, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.blackbodyMj, 1.915, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.humidityFactor, 0.08, 3); // FAO-56 Example 19, p.75–76 (0.080)
    expectPrinted(s.relativeShortwave, 0.922, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.cloudinessFactor, 0.894, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.rnlMj, 0.137, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.rnMj, 1.749, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.soilHeatFluxMj, 0.175, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(0.408 * (s.rnMj - s.soilHeatFluxMj), 0.642, 3); // FAO-56 Example 19, p.75–76
    expectPrinted(s.radiationTermMm, 0.46, 2); // FAO-56 Example 19, p.75–76
    expectPrinted(s.aerodynamicTermMm, 0.17, 2); // FAO-56 Example 19, p.75–76
    expectPrinted(day.etoMm, 0.63, 2); // FAO-56 Example 19, p.75–76 (0.63 mm/h)
  });

  it('matches the recomputed hourly values', () => {
    // docs/references.md §1, Example 19: recomputed 0.004 and 0.627 mm/h from the printed inputs.
    expectPrinted(night.etoMm, 0.004, 3);
    expectPrinted(day.etoMm, 0.627, 3);
  });
});

describe('FAO-56 Annex 2 tables (p.213–222)', () => {
  it('Table 2.1 atmospheric pressure by elevation', () => {
    const rows: [number, number][] = [
      [0, 101.3],
      [100, 100.1],
      [200, 99.0],
      [1000, 90.0],
      [1800, 81.8],
      [2000, 79.8],
      [3000, 70.5],
      [4000, 62.1],
    ];
    for (const [z, p] of rows) expectPrinted(atmosphericPressureKpa(z), p, 1); // FAO-56 Annex 2 Table 2.1
  });

  it('Table 2.2 psychrometric constant by elevation', () => {
    const rows: [number, number][] = [
      [0, 0.067],
      [100, 0.067],
      [200, 0.066],
      [1000, 0.06],
      [1800, 0.054],
      [2000, 0.053],
      [4000, 0.041],
    ];
    // FAO-56 Annex 2 Table 2.2
    for (const [z, g] of rows) expectPrinted(psychrometricConstantKpaPerC(atmosphericPressureKpa(z)), g, 3);
  });

  it('Table 2.3 saturation vapour pressure', () => {
    const rows: [number, number][] = [
      [1, 0.657],
      [10, 1.228],
      [15, 1.705],
      [20, 2.338],
      [21.5, 2.564],
      [25, 3.168],
      [30, 4.243],
      [35, 5.623],
      [40, 7.376],
      [48.5, 11.447],
    ];
    for (const [t, e] of rows) expectPrinted(saturationVapourPressureKpa(t), e, 3); // FAO-56 Annex 2 Table 2.3
  });

  it('Table 2.4 slope of the vapour pressure curve', () => {
    const rows: [number, number][] = [
      [1, 0.047],
      [10, 0.082],
      [17, 0.123],
      [20, 0.145],
      [25, 0.189],
      [30, 0.243],
      [40, 0.393],
      [48.5, 0.574],
    ];
    for (const [t, d] of rows) expectPrinted(vapourPressureSlopeKpaPerC(t), d, 3); // FAO-56 Annex 2 Table 2.4
  });

  it('Table 2.5 day of the year', () => {
    expect(dayOfYear(2025, 7, 6)).toBe(187); // FAO-56 Annex 2 Table 2.5, p.217
    expect(dayOfYear(2025, 7, 15)).toBe(196); // FAO-56 Annex 2 Table 2.5, p.217
    expect(dayOfYear(2025, 9, 3)).toBe(246); // FAO-56 Annex 2 Table 2.5, p.217
    expect(dayOfYear(2025, 4, 15)).toBe(105); // FAO-56 Annex 2 Table 2.5, p.217
    expect(dayOfYear(2025, 10, 1)).toBe(274); // FAO-56 Annex 2 Table 2.5, p.217
    expect(dayOfYear(2024, 4, 15)).toBe(106); // FAO-56 Annex 2 Table 2.5 note: add 1 from March on in leap years
    expect(dayOfYear(2024, 2, 15)).toBe(46); // FAO-56 Annex 2 Table 2.5 note: no leap-year shift before March
  });

  it('Table 2.8 σTK⁴', () => {
    const rows: [number, number][] = [
      [1, 27.7],
      [20, 36.21],
      [21.5, 36.96],
      [30, 41.41],
      [48.5, 52.49],
    ];
    for (const [t, v] of rows) expectPrinted(blackbodyRadiationMj(t), v, 2); // FAO-56 Annex 2 Table 2.8
  });

  it('Table 2.9 wind conversion factors to 2 m', () => {
    const rows: [number, number][] = [
      [1, 1.178],
      [2, 1.0],
      [3, 0.921],
      [10, 0.748],
    ];
    for (const [z, f] of rows) expectPrinted(windFactorTo2m(z), f, 3); // FAO-56 Annex 2 Table 2.9, p.222
  });
});
