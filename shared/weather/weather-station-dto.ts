/** API shapes for weather stations and their daily data. */

export const STATION_EXPOSURES = ['interior', 'coastal'] as const;
export type StationExposure = (typeof STATION_EXPOSURES)[number];

/** Where a station's daily data usually comes from. */
export const STATION_SOURCE_KINDS = ['upload', 'feed'] as const;
export type StationSourceKind = (typeof STATION_SOURCE_KINDS)[number];

/**
 * How a day's ETo was obtained. `measured`: given as ETo in an upload; the Penman–Monteith variants and
 * Hargreaves: computed from observations; `normal-filled`: missing, taken from the monthly normals.
 */
export const DAILY_WEATHER_METHODS = [
  'measured',
  'penman-monteith',
  'penman-monteith-estimated-rs',
  'hargreaves',
  'normal-filled',
] as const;
export type DailyWeatherMethod = (typeof DAILY_WEATHER_METHODS)[number];

export const DAILY_WEATHER_METHOD_LABELS: Readonly<Record<DailyWeatherMethod, string>> = {
  measured: 'ETo as supplied',
  'penman-monteith': 'Penman–Monteith (FAO-56)',
  'penman-monteith-estimated-rs': 'Penman–Monteith, radiation estimated',
  hargreaves: 'Hargreaves (temperatures only)',
  'normal-filled': 'Filled from monthly normals',
};

export const DAILY_WEATHER_SOURCES = ['upload', 'feed', 'normals'] as const;
export type DailyWeatherSource = (typeof DAILY_WEATHER_SOURCES)[number];

export const WEATHER_STATION_LIMITS = { nameMax: 120, rangeMaxDays: 800 } as const;

export interface WeatherStationDto {
  id: number;
  organisationId: number;
  organisationName: string;
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  windHeightM: number;
  exposure: StationExposure;
  sourceKind: StationSourceKind;
  /** True when the user may change the station and its data. */
  canEdit: boolean;
  dayCount: number;
  firstDate: string | null;
  lastDate: string | null;
}

export interface WeatherStationInput {
  name: string;
  latitude: number;
  longitude: number;
  elevationM: number;
  windHeightM: number;
  exposure: StationExposure;
  sourceKind: StationSourceKind;
}

export const WEATHER_STATION_SORTS = ['name', 'organisationName', 'lastDate'] as const;
export type WeatherStationSort = (typeof WEATHER_STATION_SORTS)[number];

export interface DailyWeatherDto {
  date: string;
  etoMm: number;
  rainMm: number;
  method: DailyWeatherMethod;
  source: DailyWeatherSource;
  /** True when ETo or rain came from the monthly normals. */
  filled: boolean;
  filledFields: ('eto' | 'rain')[];
}

export interface WeatherSeriesDto {
  stationId: number;
  from: string;
  to: string;
  days: DailyWeatherDto[];
  filledDays: number;
  /** Set when days are missing and no normals exist for their month, so nothing could be filled. */
  missingNormals: number[];
}

export interface MonthlyNormalDto {
  month: number;
  etoMm: number;
  rainMm: number;
}

export const WEATHER_UPLOAD_FORMATS = ['eto-rain', 'observations'] as const;
export type WeatherUploadFormat = (typeof WEATHER_UPLOAD_FORMATS)[number];

export interface WeatherGap {
  from: string;
  to: string;
  days: number;
}

/** What an upload or a feed fetch wrote. */
export interface WeatherImportReport {
  rows: number;
  inserted: number;
  updated: number;
  unchanged: number;
  from: string | null;
  to: string | null;
  /** Runs of missing days between the first and last date: filled from normals and flagged, never silent. */
  gaps: WeatherGap[];
  methods: Partial<Record<DailyWeatherMethod, number>>;
  notes: string[];
}
