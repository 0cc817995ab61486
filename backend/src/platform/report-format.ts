import type { UnitSystem } from '@shared/budgets/budget-dto';
import { formatVolume } from '@shared/units/format-quantity';
import { fromGallons } from '@shared/units/volume-units';

/**
 * How the generated documents (board packet, savings handout) write figures: volumes in the organisation's units,
 * one money style, one date style. Values arrive in base units (gal, ISO dates).
 */
export interface ReportFormat {
  /** "12,345 gal" or "46.73 m³"; "—" for null. */
  volume(gallons: number | null): string;
  /** The volume in the display unit, for chart axes. */
  volumeValue(gallons: number): number;
  volumeUnit: string;
  /** "$1,234.56"; "—" for null. */
  money(amount: number | null, currency: string | null): string;
  /** "Nov 30, 2026" from YYYY-MM-DD or an ISO instant (read in `timeZone` when given). */
  date(value: string, timeZone?: string): string;
  /** "November 2026" from YYYY-MM. */
  month(month: string): string;
  /** "Nov 2026" from YYYY-MM, for chart labels. */
  monthShort(month: string): string;
  percent(value: number | null, digits?: number): string;
}

export function reportFormat(system: UnitSystem): ReportFormat {
  const metric = system === 'metric';
  return {
    volume: (g) => (g === null ? '—' : metric ? formatVolume(fromGallons(g, 'm3'), 'm3') : formatVolume(g, 'gal')),
    volumeValue: (g) => (metric ? fromGallons(g, 'm3') : g),
    volumeUnit: metric ? 'm³' : 'gal',
    money: (amount, currency) =>
      amount === null || currency === null
        ? '—'
        : new Intl.NumberFormat('en-US', { style: 'currency', currency }).format(amount),
    date: (value, timeZone) =>
      new Intl.DateTimeFormat('en-US', {
        month: 'short',
        day: 'numeric',
        year: 'numeric',
        timeZone: value.length === 10 ? 'UTC' : (timeZone ?? 'UTC'),
      }).format(new Date(value.length === 10 ? `${value}T00:00:00Z` : value)),
    month: (month) =>
      new Intl.DateTimeFormat('en-US', { month: 'long', year: 'numeric', timeZone: 'UTC' }).format(
        new Date(`${month}-01T00:00:00Z`),
      ),
    monthShort: (month) =>
      new Intl.DateTimeFormat('en-US', { month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
        new Date(`${month}-01T00:00:00Z`),
      ),
    percent: (value, digits = 0) => (value === null ? '—' : `${value.toFixed(digits)} %`),
  };
}
