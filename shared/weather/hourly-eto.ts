import {
  atmosphericPressureKpa,
  psychrometricConstantKpaPerC,
  saturationVapourPressureKpa,
  vapourPressureSlopeKpaPerC,
} from './atmosphere';
import {
  STEFAN_BOLTZMANN_HOURLY,
  blackbodyRadiationMj,
  clearSkyRadiationMj,
  netRadiationMj,
  netShortwaveRadiationMj,
} from './net-radiation';
import { ASCE_STANDARDIZED, FAO56_HOURLY, penmanMonteith, type PenmanMonteithConstants } from './penman-monteith';
import { degreesToRadians, extraterrestrialRadiationPeriod, solarTimeAngleRad } from './solar-geometry';
import { windSpeedAt2m } from './wind-and-soil-heat';
import { IssueList } from './weather-input-error';

/**
 * Hourly reference ET.
 * - `fao56`: FAO-56 Eq. 53 (Cn 37, Cd 0.34 day and night; G = 0.1Rn by day, 0.5Rn at night, Eqs. 45–46).
 * - `asce-short` / `asce-tall`: ASCE-EWRI (2005) standardized hourly, Cd and G changing between day and
 *   night (constants from memory, see penman-monteith.ts). The two give different results at night.
 */
export type HourlyEtoMethod = 'fao56' | 'asce-short' | 'asce-tall';

export interface HourlyWeatherObservation {
  dayOfYear: number;
  /** Standard clock time at the middle of the period, h (14.5 for 14:00–15:00). */
  clockHourMidpoint: number;
  /** Length of the period, h; 1 by default. */
  periodHours?: number;
  tempC: number;
  rhPct: number;
  windSpeedMs: number;
  windHeightM?: number;
  /** Measured Rs for the period, MJ m⁻² per period; 0 or omitted at night. */
  solarRadiationMj?: number;
  /**
   * Rs/Rso to use when the sun is down or too low for a stable ratio. FAO-56 Example 19 assumes 0.8;
   * the better value is the ratio 2–3 hours before sunset.
   */
  rsOverRsoWhenDark?: number;
}

export interface HourlyStationSite {
  latitudeDeg: number;
  /** Degrees east; west is negative. */
  longitudeDegEast: number;
  /** Centre of the local standard time zone, degrees east (−120 for US Pacific, −105 Mountain, …). */
  timeZoneMeridianDegEast: number;
  elevationM: number;
}

export interface HourlyEtoResult {
  etoMm: number;
  isDaytime: boolean;
  steps: {
    pressureKpa: number;
    psychrometricKpaPerC: number;
    slopeKpaPerC: number;
    esKpa: number;
    eaKpa: number;
    windSpeed2mMs: number;
    omegaRad: number;
    omega1Rad: number;
    omega2Rad: number;
    raMj: number;
    rsoMj: number;
    rnsMj: number;
    blackbodyMj: number;
    humidityFactor: number;
    relativeShortwave: number;
    cloudinessFactor: number;
    rnlMj: number;
    rnMj: number;
    soilHeatFluxMj: number;
    radiationTermMm: number;
    aerodynamicTermMm: number;
  };
}

// Below this Rso the measured Rs/Rso is dominated by sensor noise at dawn and dusk: common practice, no source.
const MIN_RSO_FOR_RATIO_MJ = 0.05;

export function computeHourlyEto(
  obs: HourlyWeatherObservation,
  site: HourlyStationSite,
  method: HourlyEtoMethod = 'fao56',
): HourlyEtoResult {
  const issues = new IssueList();
  issues.checkRange('latitudeDeg', site.latitudeDeg, -90, 90, '°');
  issues.checkRange('longitudeDegEast', site.longitudeDegEast, -180, 180, '°');
  issues.checkRange('timeZoneMeridianDegEast', site.timeZoneMeridianDegEast, -180, 180, '°');
  issues.checkRange('dayOfYear', obs.dayOfYear, 1, 366, '');
  issues.checkRange('clockHourMidpoint', obs.clockHourMidpoint, 0, 24, 'h');
  issues.checkRange('periodHours', obs.periodHours, 0.1, 1, 'h');
  issues.checkRange('tempC', obs.tempC, -90, 60, '°C');
  issues.checkRange('rhPct', obs.rhPct, 0, 100, '%');
  issues.checkRange('windSpeedMs', obs.windSpeedMs, 0, 75, 'm/s');
  issues.checkRange('solarRadiationMj', obs.solarRadiationMj, 0, 5, 'MJ/m²/h');
  issues.checkRange('rsOverRsoWhenDark', obs.rsOverRsoWhenDark, 0.25, 1, '');
  issues.throwIfAny();

  const periodHours = obs.periodHours ?? 1;
  const latitudeRad = degreesToRadians(site.latitudeDeg);
  const pressureKpa = atmosphericPressureKpa(site.elevationM);
  const psychrometricKpaPerC = psychrometricConstantKpaPerC(pressureKpa);
  const slopeKpaPerC = vapourPressureSlopeKpaPerC(obs.tempC);
  const esKpa = saturationVapourPressureKpa(obs.tempC);
  const eaKpa = esKpa * (obs.rhPct / 100); // FAO-56 Eq. 54
  const windSpeed2mMs = windSpeedAt2m(obs.windSpeedMs, obs.windHeightM ?? 2);

  const omega = solarTimeAngleRad(
    obs.clockHourMidpoint,
    site.longitudeDegEast,
    site.timeZoneMeridianDegEast,
    obs.dayOfYear,
  );
  const ra = extraterrestrialRadiationPeriod(latitudeRad, obs.dayOfYear, omega, periodHours);
  const rsoMj = clearSkyRadiationMj(ra.raMj, site.elevationM);
  const rsMj = obs.solarRadiationMj ?? 0;
  const rnsMj = netShortwaveRadiationMj(rsMj);
  const relativeShortwave = rsoMj > MIN_RSO_FOR_RATIO_MJ ? Math.min(1, rsMj / rsoMj) : (obs.rsOverRsoWhenDark ?? 0.8);
  const blackbodyMj = blackbodyRadiationMj(obs.tempC, STEFAN_BOLTZMANN_HOURLY * periodHours);
  const humidityFactor = 0.34 - 0.14 * Math.sqrt(eaKpa);
  const cloudinessFactor = Math.max(0, 1.35 * relativeShortwave - 0.35);
  const rnlMj = blackbodyMj * humidityFactor * cloudinessFactor;
  const rnMj = netRadiationMj(rnsMj, rnlMj);
  const isDaytime = rnMj > 0;

  let constants: PenmanMonteithConstants;
  let soilFraction: number;
  if (method === 'fao56') {
    constants = FAO56_HOURLY;
    soilFraction = isDaytime ? 0.1 : 0.5;
  } else {
    const surface = method === 'asce-short' ? 'short' : 'tall';
    constants = (isDaytime ? ASCE_STANDARDIZED.hourlyDay : ASCE_STANDARDIZED.hourlyNight)[surface];
    soilFraction = ASCE_STANDARDIZED.hourlySoilHeatFraction[surface][isDaytime ? 'day' : 'night'];
  }
  const soilHeatFluxMj = soilFraction * rnMj;
  const pm = penmanMonteith(
    {
      slopeKpaPerC,
      psychrometricKpaPerC,
      netRadiationMj: rnMj,
      soilHeatFluxMj,
      meanTempC: obs.tempC,
      windSpeed2mMs,
      esKpa,
      eaKpa,
    },
    { cn: constants.cn * periodHours, cd: constants.cd },
  );
  return {
    etoMm: pm.etMm,
    isDaytime,
    steps: {
      pressureKpa,
      psychrometricKpaPerC,
      slopeKpaPerC,
      esKpa,
      eaKpa,
      windSpeed2mMs,
      omegaRad: ra.omegaRad,
      omega1Rad: ra.omega1Rad,
      omega2Rad: ra.omega2Rad,
      raMj: ra.raMj,
      rsoMj,
      rnsMj,
      blackbodyMj,
      humidityFactor,
      relativeShortwave,
      cloudinessFactor,
      rnlMj,
      rnMj,
      soilHeatFluxMj,
      radiationTermMm: pm.radiationTermMm,
      aerodynamicTermMm: pm.aerodynamicTermMm,
    },
  };
}
