import { addDays, daysInMonth, parseIsoDate } from './day-of-year';

/** A day's weather as stored: either value may be missing (null) when the station failed. */
export interface DailyWeatherRecord {
  date: string;
  etoMm: number | null;
  rainMm: number | null;
}

/** Long-term monthly totals for a site, used to fill gaps. `month` is 1–12. */
export interface MonthlyWeatherNormal {
  month: number;
  /** Total ETo for the month, mm. */
  etoMm: number;
  /** Total rain for the month, mm. */
  rainMm: number;
}

export interface FilledWeatherDay {
  date: string;
  etoMm: number;
  rainMm: number;
  /** True when any value of the day came from the monthly normals. */
  filled: boolean;
  filledFields: ('eto' | 'rain')[];
}

export interface FilledWeatherSeries {
  days: FilledWeatherDay[];
  /** Dates with at least one filled value, in order. */
  filledDates: string[];
  /** Records outside the requested period, left out. */
  ignoredDates: string[];
}

/**
 * One value per day from `startDate` to `endDate` inclusive. Missing days, or missing values on a day, take the
 * monthly normal spread evenly over the days of that month (normal total ÷ days in month). Throws on a
 * duplicated date, since two readings for one day mean the upload or the feed is wrong.
 */
export function fillWeatherGaps(
  records: readonly DailyWeatherRecord[],
  startDate: string,
  endDate: string,
  normals: readonly MonthlyWeatherNormal[],
): FilledWeatherSeries {
  if (endDate < startDate) throw new RangeError(`Period end ${endDate} is before its start ${startDate}`);
  parseIsoDate(startDate);
  parseIsoDate(endDate);
  const normalByMonth = new Map<number, MonthlyWeatherNormal>();
  for (const normal of normals) {
    if (normal.month < 1 || normal.month > 12)
      throw new RangeError(`Monthly normal has month ${normal.month}; it must be 1–12`);
    if (normalByMonth.has(normal.month)) throw new RangeError(`Monthly normals list month ${normal.month} twice`);
    if (!(normal.etoMm >= 0) || !(normal.rainMm >= 0))
      throw new RangeError(`Monthly normal for month ${normal.month} must not be negative`);
    normalByMonth.set(normal.month, normal);
  }

  const byDate = new Map<string, DailyWeatherRecord>();
  const ignoredDates: string[] = [];
  for (const record of records) {
    parseIsoDate(record.date);
    if (byDate.has(record.date)) throw new RangeError(`Weather for ${record.date} appears more than once`);
    if (record.date < startDate || record.date > endDate) {
      ignoredDates.push(record.date);
      continue;
    }
    byDate.set(record.date, record);
  }

  const days: FilledWeatherDay[] = [];
  const filledDates: string[] = [];
  for (let date = startDate; date <= endDate; date = addDays(date, 1)) {
    const record = byDate.get(date);
    const filledFields: ('eto' | 'rain')[] = [];
    const needsNormal = record?.etoMm == null || record?.rainMm == null;
    let dailyNormal = { etoMm: 0, rainMm: 0 };
    if (needsNormal) {
      const { year, month } = parseIsoDate(date);
      const normal = normalByMonth.get(month);
      if (!normal) throw new RangeError(`Weather for ${date} is missing and there is no normal for month ${month}`);
      const days = daysInMonth(year, month);
      dailyNormal = { etoMm: normal.etoMm / days, rainMm: normal.rainMm / days };
    }
    let etoMm = record?.etoMm ?? null;
    if (etoMm === null) {
      etoMm = dailyNormal.etoMm;
      filledFields.push('eto');
    }
    let rainMm = record?.rainMm ?? null;
    if (rainMm === null) {
      rainMm = dailyNormal.rainMm;
      filledFields.push('rain');
    }
    const filled = filledFields.length > 0;
    if (filled) filledDates.push(date);
    days.push({ date, etoMm, rainMm, filled, filledFields });
  }
  return { days, filledDates, ignoredDates };
}
