import { computeDailyEto, type DailyWeatherObservation, type WeatherStationSite } from './daily-eto';
import { addDays, parseIsoDate } from './day-of-year';
import { validateEto } from './eto-bounds';
import { WeatherInputError } from './weather-input-error';
import type { DailyWeatherMethod, WeatherGap, WeatherUploadFormat } from './weather-station-dto';

/**
 * Turns the rows of a daily-weather file into days ready to store, checking every cell. Row numbers count the
 * header as row 1, as a spreadsheet shows them. Pure: the caller splits the CSV and writes the result.
 */

export interface ImportedDay {
  row: number;
  date: string;
  etoMm: number | null;
  rainMm: number | null;
  method: DailyWeatherMethod;
  observations: DailyWeatherObservation | null;
  notes: string[];
}

export interface RowIssue {
  row: number;
  field: string;
  message: string;
}

export interface InterpretedRows {
  days: ImportedDay[];
  issues: RowIssue[];
}

// A day's rain above this is a unit or typing mistake (the wettest recorded days are near 1,800 mm): common practice,
// no source.
export const RAIN_DAILY_MAX_MM = 2000;
const MM_PER_INCH = 25.4;

const ETO_RAIN_COLUMNS = ['date', 'eto_mm', 'eto_in', 'rain_mm', 'rain_in'] as const;
const OBSERVATION_COLUMNS: Record<string, keyof DailyWeatherObservation | 'date' | 'rain_mm'> = {
  date: 'date',
  tmax_c: 'tMaxC',
  tmin_c: 'tMinC',
  rh_max_pct: 'rhMaxPct',
  rh_min_pct: 'rhMinPct',
  rh_mean_pct: 'rhMeanPct',
  dew_point_c: 'dewPointC',
  wind_ms: 'windSpeedMs',
  wind_height_m: 'windHeightM',
  solar_mj: 'solarRadiationMj',
  sunshine_h: 'sunshineHours',
  rain_mm: 'rain_mm',
};

/** The columns each format takes, for error messages and the upload form's help text. */
export const WEATHER_FILE_COLUMNS: Readonly<Record<WeatherUploadFormat, string>> = {
  'eto-rain': 'date, eto_mm (or eto_in), rain_mm (or rain_in)',
  observations: `date, tmax_c, tmin_c, and any of ${Object.keys(OBSERVATION_COLUMNS)
    .filter((c) => !['date', 'tmax_c', 'tmin_c'].includes(c))
    .join(', ')}`,
};

function cellNumber(text: string | undefined): number | null | 'bad' {
  const t = (text ?? '').trim();
  if (t === '') return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : 'bad';
}

function headerIssues(header: string[], allowed: readonly string[], required: string[][]): RowIssue[] {
  const issues: RowIssue[] = [];
  for (const name of header)
    if (!allowed.includes(name))
      issues.push({ row: 1, field: name || '(blank)', message: `unknown column; expected ${allowed.join(', ')}` });
  const seen = new Set<string>();
  for (const name of header) {
    if (seen.has(name)) issues.push({ row: 1, field: name, message: 'column appears twice' });
    seen.add(name);
  }
  for (const options of required) {
    const present = options.filter((o) => header.includes(o));
    if (present.length === 0)
      issues.push({ row: 1, field: options.join(' or '), message: 'required column is missing' });
    if (present.length > 1)
      issues.push({ row: 1, field: present.join(', '), message: 'give only one of these columns' });
  }
  return issues;
}

export function interpretWeatherRows(
  rawHeader: readonly string[],
  rows: readonly (readonly string[])[],
  format: WeatherUploadFormat,
  station: WeatherStationSite,
): InterpretedRows {
  const header = rawHeader.map((h) => h.trim().toLowerCase());
  const issues =
    format === 'eto-rain'
      ? headerIssues(header, ETO_RAIN_COLUMNS, [['date'], ['eto_mm', 'eto_in'], ['rain_mm', 'rain_in']])
      : headerIssues(header, Object.keys(OBSERVATION_COLUMNS), [['date'], ['tmax_c'], ['tmin_c']]);
  if (issues.length > 0) return { days: [], issues };
  if (rows.length === 0)
    return { days: [], issues: [{ row: 2, field: '(file)', message: 'the file has a header but no days' }] };

  const days: ImportedDay[] = [];
  const firstRowOfDate = new Map<string, number>();
  rows.forEach((cells, index) => {
    const row = index + 2;
    const get = (name: string) => {
      const at = header.indexOf(name);
      return at < 0 ? undefined : cells[at];
    };
    const problems: RowIssue[] = [];
    const date = (get('date') ?? '').trim();
    try {
      parseIsoDate(date);
    } catch (error) {
      problems.push({ row, field: 'date', message: (error as Error).message });
    }
    if (cells.length !== header.length)
      problems.push({ row, field: '(row)', message: `has ${cells.length} cells; the header has ${header.length}` });
    const previous = firstRowOfDate.get(date);
    if (previous !== undefined)
      problems.push({ row, field: 'date', message: `${date} is already given on row ${previous}` });
    else if (date) firstRowOfDate.set(date, row);

    const number = (name: string): number | null => {
      const value = cellNumber(get(name));
      if (value === 'bad') {
        problems.push({ row, field: name, message: `"${get(name)}" is not a number` });
        return null;
      }
      return value;
    };

    const rainColumn = header.includes('rain_in') ? 'rain_in' : 'rain_mm';
    let rainMm = header.includes(rainColumn) ? number(rainColumn) : null;
    if (rainMm !== null && rainColumn === 'rain_in') rainMm *= MM_PER_INCH;
    if (rainMm !== null && (rainMm < 0 || rainMm > RAIN_DAILY_MAX_MM)) {
      problems.push({ row, field: rainColumn, message: `rain ${rainMm} mm is outside 0..${RAIN_DAILY_MAX_MM} mm` });
    }

    if (format === 'eto-rain') {
      const etoColumn = header.includes('eto_in') ? 'eto_in' : 'eto_mm';
      let etoMm = number(etoColumn);
      if (etoMm !== null && etoColumn === 'eto_in') etoMm *= MM_PER_INCH;
      if (etoMm !== null) {
        const check = validateEto(etoMm);
        if (!check.ok) problems.push({ row, field: etoColumn, message: check.message });
      }
      if (problems.length === 0)
        days.push({ row, date, etoMm, rainMm, method: 'measured', observations: null, notes: [] });
    } else {
      const obs: DailyWeatherObservation = { date } as DailyWeatherObservation;
      for (const [column, key] of Object.entries(OBSERVATION_COLUMNS)) {
        if (key === 'date' || key === 'rain_mm' || !header.includes(column)) continue;
        const value = number(column);
        if (value !== null) (obs as unknown as Record<string, number>)[key] = value;
      }
      if (obs.tMaxC === undefined) problems.push({ row, field: 'tmax_c', message: 'is required' });
      if (obs.tMinC === undefined) problems.push({ row, field: 'tmin_c', message: 'is required' });
      if (problems.length === 0) {
        try {
          const result = computeDailyEto(obs, station);
          const check = validateEto(result.etoMm);
          if (!check.ok) problems.push({ row, field: 'eto', message: `computed ${check.message}` });
          else
            days.push({
              row,
              date,
              etoMm: result.etoMm,
              rainMm,
              method: result.method,
              observations: obs,
              notes: result.notes,
            });
        } catch (error) {
          if (error instanceof WeatherInputError) {
            for (const issue of error.issues)
              problems.push({ row, field: columnOf(issue.field), message: issue.message });
          } else {
            problems.push({ row, field: '(row)', message: (error as Error).message });
          }
        }
      }
    }
    issues.push(...problems);
  });
  return { days: issues.length ? [] : days, issues };
}

function columnOf(field: string): string {
  const entry = Object.entries(OBSERVATION_COLUMNS).find(([, key]) => key === field);
  return entry ? entry[0] : field;
}

/** Runs of missing dates between the earliest and latest of `dates`. */
export function findGaps(dates: readonly string[]): WeatherGap[] {
  if (dates.length === 0) return [];
  const sorted = [...new Set(dates)].sort();
  const gaps: WeatherGap[] = [];
  for (let i = 1; i < sorted.length; i++) {
    const expected = addDays(sorted[i - 1]!, 1);
    if (expected !== sorted[i]) {
      const to = addDays(sorted[i]!, -1);
      gaps.push({ from: expected, to, days: Math.round((Date.parse(sorted[i]!) - Date.parse(expected)) / 86_400_000) });
    }
  }
  return gaps;
}
