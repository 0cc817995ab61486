import { parse } from 'csv-parse/sync';
import type { DataSource } from 'typeorm';
import { computeDailyEto } from '@shared/weather/daily-eto';
import { findGaps, interpretWeatherRows, type ImportedDay, type RowIssue } from '@shared/weather/daily-weather-rows';
import { validateEto } from '@shared/weather/eto-bounds';
import { addDays } from '@shared/weather/day-of-year';
import { weatherByDay, type WeatherDay } from '@shared/weather/weather-by-day';
import { fillWeatherGaps, type FilledWeatherDay } from '@shared/weather/weather-gap-filling';
import { WeatherInputError } from '@shared/weather/weather-input-error';
import {
  WEATHER_STATION_LIMITS,
  type DailyWeatherDto,
  type DailyWeatherMethod,
  type WeatherImportReport,
  type WeatherSeriesDto,
  type WeatherUploadFormat,
} from '@shared/weather/weather-station-dto';
import { AppError } from '../../../platform/app-error';
import type { Principal } from '../../../platform/auth/principal';
import type { AuditRepository } from '../../audit/data/audit-repository';
import type { DayToStore, StationRecord, WeatherRepository } from '../data/weather-repository';
import type { WeatherFeedClient } from '../data/weather-feed-client';
import { stationSite, type WeatherStationsService } from './weather-stations-service';

/** A station's days for a budget, with how each was obtained; days with no weather at all are listed apart. */
export interface StationWeather {
  station: StationRecord;
  days: (WeatherDay & { method: DailyWeatherMethod; filledFields: FilledWeatherDay['filledFields'] })[];
  missingDates: string[];
  /** The station that stood in for missed days, when one did. */
  neighbourName: string | null;
}

export interface StationGaps {
  stationId: number;
  stationName: string;
  organisationId: number;
  gaps: { from: string; to: string; days: number; late: boolean }[];
}

/** How far a neighbouring station may be to stand in for a missed day (common practice, no source). */
const NEIGHBOUR_MAX_KM = 50;

/**
 * Daily weather: CSV uploads, fetches from the feed, and the gap-filled series budgets and charts read.
 * Every write is one transaction: a file with one bad row writes nothing.
 */
export class DailyWeatherService {
  constructor(
    private readonly db: DataSource,
    private readonly weather: WeatherRepository,
    private readonly stations: WeatherStationsService,
    private readonly feed: WeatherFeedClient,
    private readonly audit: AuditRepository,
  ) {}

  async upload(
    principal: Principal,
    stationId: number,
    format: WeatherUploadFormat,
    csv: string,
  ): Promise<WeatherImportReport> {
    const station = await this.stations.requireWritable(principal, stationId);
    let records: string[][];
    try {
      records = parse(csv.replace(/^\uFEFF/, ''), {
        skip_empty_lines: true,
        relax_column_count: true,
        trim: true,
      }) as string[][];
    } catch (error) {
      throw AppError.invalid('file', `is not readable CSV (${(error as Error).message})`);
    }
    if (records.length === 0) throw AppError.invalid('file', 'is empty');
    const [header, ...rows] = records;
    const { days, issues } = interpretWeatherRows(header!, rows, format, stationSite(station));
    if (issues.length) throw rowsInvalid(issues);
    return this.store(principal, station, days, 'upload', 'upload');
  }

  async fetchFromFeed(principal: Principal, stationId: number, from: string, to: string): Promise<WeatherImportReport> {
    const station = await this.stations.requireWritable(principal, stationId);
    checkRange(from, to);
    const feedDays = await this.feed.dailyObservations(station.latitude, station.longitude, from, to);
    const site = stationSite(station);
    const days: ImportedDay[] = [];
    const issues: RowIssue[] = [];
    feedDays.forEach(({ observation, rainMm }, index) => {
      try {
        const result = computeDailyEto(observation, site);
        const check = validateEto(result.etoMm);
        if (!check.ok) throw new RangeError(check.message);
        days.push({
          row: index + 1,
          date: observation.date!,
          etoMm: result.etoMm,
          rainMm,
          method: result.method,
          observations: observation,
          notes: result.notes,
        });
      } catch (error) {
        const message =
          error instanceof WeatherInputError
            ? error.issues.map((i) => `${i.field}: ${i.message}`).join('; ')
            : (error as Error).message;
        issues.push({ row: index + 1, field: observation.date ?? 'date', message });
      }
    });
    if (issues.length)
      throw new AppError(
        'upstream_unavailable',
        `The weather feed sent ${issues.length} day(s) that fail the physical checks; nothing was stored.`,
        issues.map((i) => ({ field: `day ${i.row} (${i.field})`, message: i.message })),
      );
    const inRange = days.filter((d) => d.date >= from && d.date <= to);
    const report = await this.store(principal, station, inRange, 'feed', 'fetch');
    // Days the feed left out inside the requested range are gaps too, not only those between returned days.
    report.gaps = gapsWithin(
      from,
      to,
      inRange.map((d) => d.date),
    );
    return report;
  }

  /** A station's days from `from` to `to`, gaps filled from normals and flagged. */
  async series(principal: Principal, stationId: number, from: string, to: string): Promise<WeatherSeriesDto> {
    const station = await this.stations.requireVisible(principal, stationId);
    checkRange(from, to);
    const stored = await this.weather.days(stationId, from, to);
    const normals = await this.weather.normals(stationId);
    const byDate = new Map(stored.map((d) => [d.date, d]));
    const haveNormal = new Set(normals.map((n) => n.month));
    const missingNormals = new Set<number>();
    const days: DailyWeatherDto[] = [];
    // Fill month by month so a month without normals still shows its measured days.
    for (const [monthFrom, monthTo] of monthSpans(from, to)) {
      const month = Number(monthFrom.slice(5, 7));
      const monthStored = stored.filter((d) => d.date >= monthFrom && d.date <= monthTo);
      if (!haveNormal.has(month)) {
        const complete = monthStored.filter((d) => d.etoMm !== null && d.rainMm !== null);
        if (complete.length < daysBetween(monthFrom, monthTo)) missingNormals.add(month);
        days.push(
          ...complete.map((d) => ({
            date: d.date,
            etoMm: d.etoMm!,
            rainMm: d.rainMm!,
            method: d.method,
            source: d.source,
            filled: false,
            filledFields: [],
          })),
        );
        continue;
      }
      const filled = fillWeatherGaps(monthStored, monthFrom, monthTo, normals);
      for (const day of filled.days) {
        const record = byDate.get(day.date);
        days.push({
          date: day.date,
          etoMm: day.etoMm,
          rainMm: day.rainMm,
          method: record && !day.filledFields.includes('eto') ? record.method : 'normal-filled',
          source: record ? record.source : 'normals',
          filled: day.filled,
          filledFields: day.filledFields,
        });
      }
    }
    return {
      stationId: station.id,
      from,
      to,
      days,
      filledDays: days.filter((d) => d.filled).length,
      missingNormals: [...missingNormals].sort((a, b) => a - b),
    };
  }

  /**
   * The weather a site's budget uses, day by day (see weather-by-day.ts): measured, else the normals, else estimated
   * from the station's days around it or the nearest station of the organisation (within 50 km; common practice, no
   * source), else left out and listed in `missingDates`. Never throws for a gap.
   */
  async forBudget(station: StationRecord, from: string, to: string): Promise<StationWeather> {
    const [stored, normals] = await Promise.all([
      this.weather.days(station.id, addDays(from, -7), addDays(to, 7)),
      this.weather.normals(station.id),
    ]);
    let result = weatherByDay({ records: stored, from, to, normals });
    let neighbourName: string | null = null;
    if (result.missingDates.length > 0) {
      const near = await this.weather.nearestStation(station.id, NEIGHBOUR_MAX_KM);
      if (near) {
        const neighbour = await this.weather.days(near.id, result.missingDates[0]!, result.missingDates.at(-1)!);
        result = weatherByDay({ records: stored, from, to, normals, neighbour });
        neighbourName = near.name;
      }
    }
    const method = new Map(stored.map((d) => [d.date, d.method]));
    return {
      station,
      neighbourName,
      missingDates: result.missingDates,
      days: result.days.map((d) => ({
        ...d,
        filledFields: [],
        method: d.source === 'station' ? (method.get(d.date) ?? 'measured') : 'normal-filled',
      })),
    };
  }

  /**
   * Runs of days each station is missing in [from, to], for the nightly watch's weather-health check; a run that
   * reaches `to` is the station being late. Days before a station's first day are not gaps.
   */
  async gaps(stationIds: number[], from: string, to: string): Promise<StationGaps[]> {
    const coverage = await this.weather.coverage(stationIds, from, to);
    return coverage
      .filter((c) => c.firstDate !== null && c.firstDate <= to)
      .map((c) => ({
        stationId: c.id,
        stationName: c.name,
        organisationId: c.organisationId,
        gaps: gapsWithin(c.firstDate! > from ? c.firstDate! : from, to, c.dates).map((g) => ({
          from: g.from,
          to: g.to,
          days: g.days,
          late: g.to === to,
        })),
      }))
      .filter((c) => c.gaps.length > 0);
  }

  /** The same, for uses that need every day (annual compliance, savings): a left-out day is a clear error. */
  async forWholePeriod(station: StationRecord, from: string, to: string): Promise<StationWeather> {
    const weather = await this.forBudget(station, from, to);
    if (weather.missingDates.length > 0) {
      const first = weather.missingDates[0]!;
      const message = `Weather for ${first} is missing and there is no normal for month ${Number(first.slice(5, 7))}`;
      throw new AppError(
        'validation_failed',
        `Weather for station "${station.name}" is incomplete: ${message} (${weather.missingDates.length} day(s)). ` +
          "Upload or fetch the missing days, or enter the station's monthly normals.",
        [{ field: 'weather', message }],
      );
    }
    return weather;
  }

  /**
   * Daily ETo (mm) of the station a site takes its weather from, gap-filled from the station's monthly normals
   * where it can be; null when the site has no station. For components that already checked access (uploads
   * spreading a bill over its days).
   */
  async siteDailyEto(siteId: number, from: string, to: string): Promise<Map<string, number | null> | null> {
    const stationId = await this.weather.stationIdOfSite(siteId);
    if (stationId === null) return null;
    const stored = await this.weather.days(stationId, from, to);
    try {
      const filled = fillWeatherGaps(stored, from, to, await this.weather.normals(stationId));
      return new Map(filled.days.map((d) => [d.date, d.etoMm]));
    } catch {
      // Days missing and no normal for their month: only the stored days are known.
      return new Map(stored.map((d) => [d.date, d.etoMm]));
    }
  }

  private async store(
    principal: Principal,
    station: StationRecord,
    days: ImportedDay[],
    source: 'upload' | 'feed',
    action: string,
  ): Promise<WeatherImportReport> {
    const toStore: DayToStore[] = days.map((d) => ({
      date: d.date,
      etoMm: d.etoMm,
      rainMm: d.rainMm,
      method: d.method,
      source,
      observations: d.observations ? JSON.stringify(d.observations) : null,
    }));
    const counts = await this.db.transaction(async (em) => {
      const result = await this.weather.upsertDays(em, station.id, toStore);
      await this.audit.record(em, {
        userId: principal.userId,
        organisationId: station.organisationId,
        entity: 'weather_station',
        entityId: station.id,
        action,
        changes: { rows: days.length, ...result },
      });
      return result;
    });
    const dates = days.map((d) => d.date).sort();
    const methods: WeatherImportReport['methods'] = {};
    for (const d of days) methods[d.method] = (methods[d.method] ?? 0) + 1;
    const blanks = days.filter((d) => d.etoMm === null || d.rainMm === null).length;
    const notes = [...new Set(days.flatMap((d) => d.notes))];
    if (blanks)
      notes.unshift(
        `${blanks} day(s) have a blank ETo or rain value; budgets fill them from the monthly normals and flag them.`,
      );
    return {
      rows: days.length,
      ...counts,
      from: dates[0] ?? null,
      to: dates[dates.length - 1] ?? null,
      gaps: findGaps(dates),
      methods,
      notes,
    };
  }
}

function rowsInvalid(issues: RowIssue[]): AppError {
  const shown = issues.slice(0, 50);
  const more = issues.length > shown.length ? ` (and ${issues.length - shown.length} more)` : '';
  return new AppError(
    'validation_failed',
    `The weather file has ${issues.length} problem(s); nothing was ` +
      `stored. First: row ${issues[0]!.row}, ${issues[0]!.field}: ${issues[0]!.message}${more}`,
    shown.map((i) => ({ field: `row ${i.row}.${i.field}`, message: i.message })),
  );
}

function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1;
}

function checkRange(from: string, to: string): void {
  if (to < from) throw AppError.invalid('to', `${to} is before ${from}`);
  if (daysBetween(from, to) > WEATHER_STATION_LIMITS.rangeMaxDays)
    throw AppError.invalid('to', `at most ${WEATHER_STATION_LIMITS.rangeMaxDays} days at a time`);
}

/** Missing dates from `from` to `to` inclusive, as runs. */
function gapsWithin(from: string, to: string, dates: string[]) {
  const present = new Set(dates);
  const runs: { from: string; to: string; days: number }[] = [];
  for (let t = Date.parse(from); t <= Date.parse(to); t += 86_400_000) {
    const date = new Date(t).toISOString().slice(0, 10);
    if (present.has(date)) continue;
    const last = runs[runs.length - 1];
    if (last && Date.parse(last.to) + 86_400_000 === t) {
      last.to = date;
      last.days++;
    } else runs.push({ from: date, to: date, days: 1 });
  }
  return runs;
}

/** [first, last] date of each calendar month touched by the range, clipped to it. */
export function monthSpans(from: string, to: string): [string, string][] {
  const spans: [string, string][] = [];
  let cursor = from;
  while (cursor <= to) {
    const [y, m] = cursor.split('-').map(Number) as [number, number];
    const monthEnd = new Date(Date.UTC(y, m, 0)).toISOString().slice(0, 10);
    const end = monthEnd < to ? monthEnd : to;
    spans.push([cursor, end]);
    cursor = new Date(Date.UTC(y, m, 1)).toISOString().slice(0, 10);
  }
  return spans;
}
