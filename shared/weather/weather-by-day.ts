/**
 * Weather for budgets, day by day, that degrades instead of failing: a day the station measured is used as is; a
 * missing value comes from the station's monthly normals when they exist; else it is estimated from the station's
 * own days around it (at least three within a week) or from the nearest station of the same organisation on the
 * same date, and flagged; else the day is left out, so its month's budget covers fewer days and says so.
 */
import { addDays, daysInMonth, parseIsoDate } from './day-of-year';
import type { DailyWeatherRecord, MonthlyWeatherNormal } from './weather-gap-filling';

export const WEATHER_DAY_SOURCES = ['station', 'normals', 'recent-days', 'neighbour'] as const;
export type WeatherDaySource = (typeof WEATHER_DAY_SOURCES)[number];

export interface WeatherDay {
  date: string;
  etoMm: number;
  rainMm: number;
  /** Where the day's values came from (the weakest source when the two values differ). */
  source: WeatherDaySource;
  /** True when any value came from the normals (as before). */
  filled: boolean;
  /** True when any value was estimated (recent days or a neighbouring station). */
  estimated: boolean;
}

export interface WeatherByDay {
  days: WeatherDay[];
  /** Days with no weather at all: left out of the budget. */
  missingDates: string[];
}

/** Days within this many days either side may stand in for a missing one; at least `RECENT_MIN_DAYS` of them. */
const RECENT_WINDOW_DAYS = 7;
const RECENT_MIN_DAYS = 3;

const RANK: Record<WeatherDaySource, number> = { station: 0, normals: 1, 'recent-days': 2, neighbour: 3 };

type Pick = { value: number; source: WeatherDaySource } | null;

export interface WeatherByDayInput {
  /** The station's stored days; may reach a week beyond the period either side (used for estimates only). */
  records: readonly DailyWeatherRecord[];
  from: string;
  to: string;
  normals: readonly MonthlyWeatherNormal[];
  /** The nearest other station's stored days over the same dates, when there is one. */
  neighbour?: readonly DailyWeatherRecord[];
}

export function weatherByDay(input: WeatherByDayInput): WeatherByDay {
  const byDate = new Map(input.records.map((r) => [r.date, r]));
  const neighbour = new Map((input.neighbour ?? []).map((r) => [r.date, r]));
  const normals = new Map(input.normals.map((n) => [n.month, n]));
  const days: WeatherDay[] = [];
  const missingDates: string[] = [];
  for (let date = input.from; date <= input.to; date = addDays(date, 1)) {
    const pickOf = (field: 'etoMm' | 'rainMm'): Pick => {
      const stored = byDate.get(date)?.[field];
      if (stored != null) return { value: stored, source: 'station' };
      const { year, month } = parseIsoDate(date);
      const normal = normals.get(month);
      if (normal) return { value: normal[field] / daysInMonth(year, month), source: 'normals' };
      const recent = recentMean(byDate, date, field);
      if (recent !== null) return { value: recent, source: 'recent-days' };
      const near = neighbour.get(date)?.[field];
      return near != null ? { value: near, source: 'neighbour' } : null;
    };
    const eto = pickOf('etoMm');
    const rain = pickOf('rainMm');
    if (!eto || !rain) {
      missingDates.push(date);
      continue;
    }
    const source = RANK[eto.source] >= RANK[rain.source] ? eto.source : rain.source;
    days.push({
      date,
      etoMm: eto.value,
      rainMm: rain.value,
      source,
      filled: eto.source === 'normals' || rain.source === 'normals',
      estimated: RANK[source] >= RANK['recent-days'],
    });
  }
  return { days, missingDates };
}

function recentMean(
  byDate: ReadonlyMap<string, DailyWeatherRecord>,
  date: string,
  field: 'etoMm' | 'rainMm',
): number | null {
  const values: number[] = [];
  for (let k = -RECENT_WINDOW_DAYS; k <= RECENT_WINDOW_DAYS; k++) {
    const v = k === 0 ? null : byDate.get(addDays(date, k))?.[field];
    if (v != null) values.push(v);
  }
  return values.length >= RECENT_MIN_DAYS ? values.reduce((s, v) => s + v, 0) / values.length : null;
}

/** Plain words for the sources, for the budget's notes and the watch's warnings. */
export const WEATHER_DAY_SOURCE_WORDS: Record<WeatherDaySource, string> = {
  station: "the station's own measurement",
  normals: "the station's monthly normals",
  'recent-days': "the mean of the station's own days within a week",
  neighbour: 'the nearest station of the same organisation, same date',
};
