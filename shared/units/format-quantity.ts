import { AREA_UNIT_LABELS, type AreaUnit, type DepthUnit } from './area-depth-units';
import { VOLUME_UNIT_LABELS, type VolumeUnit } from './volume-units';

/** Options shared by the formatters; `locale` defaults to en-US because the product is US-first. */
export interface QuantityFormatOptions {
  locale?: string;
  /** Digits after the decimal point; each unit has a sensible default. */
  fractionDigits?: number;
}

// Whole gallons and litres are precise enough for budgets; bigger units need decimals to be useful.
const VOLUME_DEFAULT_DIGITS: Readonly<Record<VolumeUnit, number>> = {
  gal: 0,
  l: 0,
  ft3: 0,
  kgal: 2,
  ccf: 2,
  m3: 2,
  'acre-in': 3,
  'acre-ft': 3,
};

function formatNumber(value: number, digits: number, locale: string): string {
  if (!Number.isFinite(value)) throw new RangeError(`Cannot format ${value}: not a finite number`);
  const text = new Intl.NumberFormat(locale, {
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(value);
  // Avoid "-0" when a tiny negative rounds to zero.
  return /^-0([.,]0+)?$/.test(text) ? text.slice(1) : text;
}

/** `formatVolume(1234.5, 'gal')` → "1,235 gal". The unit is always part of the text. */
export function formatVolume(value: number, unit: VolumeUnit, options: QuantityFormatOptions = {}): string {
  const digits = options.fractionDigits ?? VOLUME_DEFAULT_DIGITS[unit];
  return `${formatNumber(value, digits, options.locale ?? 'en-US')} ${VOLUME_UNIT_LABELS[unit]}`;
}

/** `formatArea(12000, 'ft2')` → "12,000 ft²". */
export function formatArea(value: number, unit: AreaUnit, options: QuantityFormatOptions = {}): string {
  const digits = options.fractionDigits ?? (unit === 'acre' ? 2 : 0);
  return `${formatNumber(value, digits, options.locale ?? 'en-US')} ${AREA_UNIT_LABELS[unit]}`;
}

/** `formatDepth(0.2, 'in')` → "0.20 in"; millimetres default to one decimal. */
export function formatDepth(value: number, unit: DepthUnit, options: QuantityFormatOptions = {}): string {
  const digits = options.fractionDigits ?? (unit === 'in' ? 2 : 1);
  return `${formatNumber(value, digits, options.locale ?? 'en-US')} ${unit}`;
}
