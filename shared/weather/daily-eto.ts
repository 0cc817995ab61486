import {
  actualVapourPressureFromDewPoint,
  actualVapourPressureFromRhExtremes,
  actualVapourPressureFromRhMax,
  actualVapourPressureFromRhMean,
  actualVapourPressureFromTmin,
} from './actual-vapour-pressure';
import {
  atmosphericPressureKpa,
  meanSaturationVapourPressureKpa,
  psychrometricConstantKpaPerC,
  vapourPressureSlopeKpaPerC,
} from './atmosphere';
import { dayOfYearFromIso } from './day-of-year';
import { hargreavesEtoMm } from './hargreaves';
import {
  KRS,
  clearSkyRadiationMj,
  netLongwaveRadiation,
  netRadiationMj,
  netShortwaveRadiationMj,
  solarRadiationFromSunshineMj,
  solarRadiationFromTemperatureMj,
} from './net-radiation';
import { FAO56_DAILY, penmanMonteith } from './penman-monteith';
import { daylightHours, degreesToRadians, extraterrestrialRadiationDailyMj } from './solar-geometry';
import { DEFAULT_WIND_SPEED_2M, MINIMUM_WIND_SPEED_2M, windSpeedAt2m } from './wind-and-soil-heat';
import { IssueList } from './weather-input-error';

/** One day of station data. Only the temperatures are required; the rest is used when present. */
export interface DailyWeatherObservation {
  /** ISO date "YYYY-MM-DD"; or give `dayOfYear` directly. */
  date?: string;
  dayOfYear?: number;
  tMaxC: number;
  tMinC: number;
  rhMaxPct?: number;
  rhMinPct?: number;
  rhMeanPct?: number;
  dewPointC?: number;
  /** Mean wind speed at `windHeightM` (or the station's height), m/s. */
  windSpeedMs?: number;
  windHeightM?: number;
  /** Measured solar radiation Rs, MJ m⁻² d⁻¹. */
  solarRadiationMj?: number;
  /** Bright sunshine hours n. */
  sunshineHours?: number;
}

export interface WeatherStationSite {
  latitudeDeg: number;
  elevationM: number;
  /** Anemometer height, m; 2 m when not given. */
  windHeightM?: number;
  /** Chooses kRs for Rs from temperature (FAO-56 Eq. 50): 0.16 interior, 0.19 coastal. Interior by default. */
  exposure?: 'interior' | 'coastal';
  /** Dew point below Tmin for arid sites when ea falls back to Tmin (FAO-56 suggests 2–3 °C); 0 by default. */
  aridityOffsetC?: number;
}

export type DailyEtoMethod = 'penman-monteith' | 'penman-monteith-estimated-rs' | 'hargreaves';

/** Intermediate values, kept so the "how computed" view and the tests can show each step. */
export interface DailyEtoSteps {
  dayOfYear: number;
  raMj: number;
  pressureKpa?: number;
  psychrometricKpaPerC?: number;
  meanTempC: number;
  slopeKpaPerC?: number;
  esKpa?: number;
  eaKpa?: number;
  windSpeed2mMs?: number;
  daylightHours?: number;
  rsMj?: number;
  rsoMj?: number;
  rnsMj?: number;
  rnlMj?: number;
  rnMj?: number;
  radiationTermMm?: number;
  aerodynamicTermMm?: number;
}

export interface DailyEtoResult {
  etoMm: number;
  method: DailyEtoMethod;
  /** Sentences saying which inputs were estimated and how. */
  notes: string[];
  steps: DailyEtoSteps;
}

// Bounds just outside the world records (−89.2 °C, 56.7 °C) and a generous wind limit: common practice, no source.
const TEMPERATURE_BOUNDS_C = [-90, 60] as const;
const WIND_BOUND_MS = 75;

function validate(obs: DailyWeatherObservation, site: WeatherStationSite): number {
  const issues = new IssueList();
  issues.checkRange('latitudeDeg', site.latitudeDeg, -90, 90, '°');
  // Lowest dry land (Dead Sea shore, about −430 m) to above the highest weather stations: common practice, no source.
  issues.checkRange('elevationM', site.elevationM, -450, 9000, 'm');
  issues.checkRange('tMaxC', obs.tMaxC, ...TEMPERATURE_BOUNDS_C, '°C');
  issues.checkRange('tMinC', obs.tMinC, ...TEMPERATURE_BOUNDS_C, '°C');
  if (obs.tMaxC < obs.tMinC) issues.add('tMaxC', `Tmax ${obs.tMaxC} °C is below Tmin ${obs.tMinC} °C`);
  issues.checkRange('rhMaxPct', obs.rhMaxPct, 0, 100, '%');
  issues.checkRange('rhMinPct', obs.rhMinPct, 0, 100, '%');
  issues.checkRange('rhMeanPct', obs.rhMeanPct, 0, 100, '%');
  if (obs.rhMaxPct !== undefined && obs.rhMinPct !== undefined && obs.rhMinPct > obs.rhMaxPct) {
    issues.add('rhMinPct', `RHmin ${obs.rhMinPct} % is above RHmax ${obs.rhMaxPct} %`);
  }
  issues.checkRange('dewPointC', obs.dewPointC, ...TEMPERATURE_BOUNDS_C, '°C');
  // Air cannot hold more vapour than saturation, so the day's dew point cannot exceed its maximum temperature.
  if (obs.dewPointC !== undefined && obs.dewPointC > obs.tMaxC) {
    issues.add('dewPointC', `dew point ${obs.dewPointC} °C is above Tmax ${obs.tMaxC} °C`);
  }
  issues.checkRange('windSpeedMs', obs.windSpeedMs, 0, WIND_BOUND_MS, 'm/s');
  issues.checkRange('windHeightM', obs.windHeightM ?? site.windHeightM, 0.5, 100, 'm');
  issues.checkRange('solarRadiationMj', obs.solarRadiationMj, 0, 50, 'MJ/m²/d');
  issues.checkRange('sunshineHours', obs.sunshineHours, 0, 24, 'h');
  issues.checkRange('aridityOffsetC', site.aridityOffsetC, 0, 5, '°C');
  let j = obs.dayOfYear;
  if (j === undefined && obs.date !== undefined) {
    try {
      j = dayOfYearFromIso(obs.date);
    } catch (error) {
      issues.add('date', (error as Error).message);
    }
  }
  if (j === undefined) issues.add('date', 'give a date or a day of year');
  else issues.checkRange('dayOfYear', j, 1, 366, '');
  issues.throwIfAny();
  return j!;
}

function actualVapourPressure(obs: DailyWeatherObservation, site: WeatherStationSite, notes: string[]): number {
  if (obs.dewPointC !== undefined) return actualVapourPressureFromDewPoint(obs.dewPointC);
  if (obs.rhMaxPct !== undefined && obs.rhMinPct !== undefined) {
    return actualVapourPressureFromRhExtremes(obs.tMaxC, obs.tMinC, obs.rhMaxPct, obs.rhMinPct);
  }
  if (obs.rhMaxPct !== undefined) {
    notes.push('Actual vapour pressure from RHmax only (FAO-56 Eq. 18).');
    return actualVapourPressureFromRhMax(obs.tMinC, obs.rhMaxPct);
  }
  if (obs.rhMeanPct !== undefined) {
    notes.push('Actual vapour pressure from mean RH (FAO-56 Eq. 19), less accurate than RHmax/RHmin.');
    return actualVapourPressureFromRhMean(obs.tMaxC, obs.tMinC, obs.rhMeanPct);
  }
  const offset = site.aridityOffsetC ?? 0;
  notes.push(
    offset > 0
      ? `No humidity data: dew point estimated as Tmin − ${offset} °C (FAO-56 Eq. 48, arid adjustment).`
      : 'No humidity data: dew point estimated as Tmin (FAO-56 Eq. 48).',
  );
  return actualVapourPressureFromTmin(obs.tMinC, offset);
}

/**
 * Daily grass-reference ETo, mm/d, from whatever a station reports.
 * Penman–Monteith (FAO-56 Eq. 6) is used when humidity, wind or radiation is known, filling the rest
 * by FAO-56's missing-data rules; with temperatures alone it falls back to Hargreaves (FAO-56 Eq. 52).
 * Throws WeatherInputError listing every out-of-bounds input.
 */
export function computeDailyEto(obs: DailyWeatherObservation, site: WeatherStationSite): DailyEtoResult {
  const dayOfYear = validate(obs, site);
  const notes: string[] = [];
  const latitudeRad = degreesToRadians(site.latitudeDeg);
  const raMj = extraterrestrialRadiationDailyMj(latitudeRad, dayOfYear);
  const meanTempC = (obs.tMaxC + obs.tMinC) / 2;

  const hasHumidity = [obs.dewPointC, obs.rhMaxPct, obs.rhMinPct, obs.rhMeanPct].some((v) => v !== undefined);
  const hasWind = obs.windSpeedMs !== undefined;
  const hasRadiation = obs.solarRadiationMj !== undefined || obs.sunshineHours !== undefined;
  if (!hasHumidity && !hasWind && !hasRadiation) {
    notes.push('Only temperatures available: Hargreaves equation (FAO-56 Eq. 52).');
    return {
      etoMm: hargreavesEtoMm(obs.tMaxC, obs.tMinC, raMj),
      method: 'hargreaves',
      notes,
      steps: { dayOfYear, raMj, meanTempC },
    };
  }

  const pressureKpa = atmosphericPressureKpa(site.elevationM);
  const psychrometricKpaPerC = psychrometricConstantKpaPerC(pressureKpa);
  const slopeKpaPerC = vapourPressureSlopeKpaPerC(meanTempC);
  const esKpa = meanSaturationVapourPressureKpa(obs.tMaxC, obs.tMinC);
  const eaRawKpa = actualVapourPressure(obs, site, notes);
  // Humidity sensors read a little over saturation in fog; ea above es would make the drying term negative.
  const eaKpa = Math.min(eaRawKpa, esKpa);
  if (eaRawKpa > esKpa) notes.push('Actual vapour pressure was above saturation; limited to es.');

  let windSpeed2mMs: number;
  if (obs.windSpeedMs === undefined) {
    windSpeed2mMs = DEFAULT_WIND_SPEED_2M;
    notes.push(`No wind data: wind at 2 m defaulted to ${DEFAULT_WIND_SPEED_2M} m/s (FAO-56 p.63).`);
  } else {
    const heightM = obs.windHeightM ?? site.windHeightM ?? 2;
    windSpeed2mMs = windSpeedAt2m(obs.windSpeedMs, heightM);
    if (heightM !== 2) notes.push(`Wind measured at ${heightM} m converted to 2 m (FAO-56 Eq. 47).`);
    if (windSpeed2mMs < MINIMUM_WIND_SPEED_2M) {
      notes.push(
        `Wind at 2 m raised from ${windSpeed2mMs.toFixed(2)} to ${MINIMUM_WIND_SPEED_2M} ` +
          'm/s (FAO-56 p.63 lower limit).',
      );
      windSpeed2mMs = MINIMUM_WIND_SPEED_2M;
    }
  }

  const dayLength = daylightHours(latitudeRad, dayOfYear);
  let method: DailyEtoMethod = 'penman-monteith';
  let rsMj: number;
  if (obs.solarRadiationMj !== undefined) {
    rsMj = obs.solarRadiationMj;
  } else if (obs.sunshineHours !== undefined) {
    rsMj = solarRadiationFromSunshineMj(raMj, Math.min(obs.sunshineHours, dayLength), dayLength);
    notes.push('Solar radiation from sunshine hours (FAO-56 Eq. 35, a = 0.25, b = 0.50).');
    if (obs.sunshineHours > dayLength + 0.1) {
      notes.push(
        `Sunshine ${obs.sunshineHours} h exceeds the day length ${dayLength.toFixed(1)} h; limited to the day length.`,
      );
    }
  } else {
    const exposure = site.exposure ?? 'interior';
    rsMj = solarRadiationFromTemperatureMj(raMj, obs.tMaxC, obs.tMinC, KRS[exposure]);
    method = 'penman-monteith-estimated-rs';
    notes.push(
      `No radiation data: Rs estimated from the temperature range (FAO-56 Eq. 50, kRs ${KRS[exposure]}, ${exposure}).`,
    );
  }

  const rsoMj = clearSkyRadiationMj(raMj, site.elevationM);
  if (obs.solarRadiationMj !== undefined && rsMj > raMj) {
    const issues = new IssueList();
    issues.add(
      'solarRadiationMj',
      `Rs ${rsMj} MJ/m²/d exceeds the extraterrestrial radiation ${raMj.toFixed(1)} for this day and latitude`,
    );
    issues.throwIfAny();
  }
  const rnsMj = netShortwaveRadiationMj(rsMj);
  const rnl = netLongwaveRadiation(obs.tMaxC, obs.tMinC, eaKpa, rsoMj > 0 ? rsMj / rsoMj : 1);
  const rnMj = netRadiationMj(rnsMj, rnl.rnlMj);
  // Daily soil heat flux under a grass reference is small enough to ignore (FAO-56 Eq. 42).
  const pm = penmanMonteith(
    {
      slopeKpaPerC,
      psychrometricKpaPerC,
      netRadiationMj: rnMj,
      soilHeatFluxMj: 0,
      meanTempC,
      windSpeed2mMs,
      esKpa,
      eaKpa,
    },
    FAO56_DAILY,
  );
  // Dew and condensation can make the equation slightly negative on calm humid nights; a daily budget counts that as 0.
  const etoMm = Math.max(0, pm.etMm);
  return {
    etoMm,
    method,
    notes,
    steps: {
      dayOfYear,
      raMj,
      pressureKpa,
      psychrometricKpaPerC,
      meanTempC,
      slopeKpaPerC,
      esKpa,
      eaKpa,
      windSpeed2mMs,
      daylightHours: dayLength,
      rsMj,
      rsoMj,
      rnsMj,
      rnlMj: rnl.rnlMj,
      rnMj,
      radiationTermMm: pm.radiationTermMm,
      aerodynamicTermMm: pm.aerodynamicTermMm,
    },
  };
}
