/**
 * A billing period's usage → one volume per local day, so months and budgets can be compared: in proportion to
 * each day's reference evapotranspiration (ETo) when the site's weather covers every day of the period (irrigation
 * demand follows ETo; the same weighting spreads a month's budget over its days), evenly otherwise, and said so.
 * The day volumes add up to the period's exactly (the last day takes the rounding remainder).
 */

export type SpreadMethod = 'eto' | 'even';

export interface DayShare {
  date: string;
  volume: number;
}

export interface SpreadPeriod {
  method: SpreadMethod;
  days: DayShare[];
}

const round6 = (x: number) => Math.round(x * 1e6) / 1e6;

/** Every local date from `start` to `end`, both included (`YYYY-MM-DD`). */
export function datesBetween(start: string, end: string): string[] {
  const out: string[] = [];
  for (let ms = Date.parse(`${start}T00:00:00Z`); ms <= Date.parse(`${end}T00:00:00Z`); ms += 86_400_000) {
    out.push(new Date(ms).toISOString().slice(0, 10));
  }
  return out;
}

/** Spreads `volume` over the period's days; `etoMm` gives each day's ETo where known. */
export function spreadPeriod(
  period: { startDate: string; endDate: string; volume: number },
  etoMm: ReadonlyMap<string, number | null>,
): SpreadPeriod {
  const dates = datesBetween(period.startDate, period.endDate);
  const etos = dates.map((d) => etoMm.get(d) ?? null);
  const total = etos.reduce<number>((sum, e) => sum + (e ?? 0), 0);
  const byEto = etos.every((e) => e !== null && e >= 0) && total > 0;
  const weights = byEto ? etos.map((e) => e! / total) : dates.map(() => 1 / dates.length);
  let given = 0;
  const days = dates.map((date, i) => {
    const volume = i === dates.length - 1 ? round6(period.volume - given) : round6(period.volume * weights[i]!);
    given += volume;
    return { date, volume };
  });
  return { method: byEto ? 'eto' : 'even', days };
}
