import { describe, expect, it } from 'vitest';
import { formatArea, formatDepth, formatVolume } from './format-quantity';

describe('quantity formatting', () => {
  it('when formatting gallons, then it rounds to whole gallons with grouping and the unit', () => {
    expect(formatVolume(1234.5, 'gal')).toBe('1,235 gal');
  });

  it('when formatting CCF and m³, then two decimals and the unit label are shown', () => {
    expect(formatVolume(12.345, 'ccf')).toBe('12.35 CCF');
    expect(formatVolume(3, 'm3')).toBe('3.00 m³');
  });

  it('when fraction digits or locale are given, then they are used', () => {
    expect(formatVolume(1234.5, 'l', { fractionDigits: 1 })).toBe('1,234.5 L');
    expect(formatVolume(1234.5, 'l', { locale: 'de-DE', fractionDigits: 1 })).toBe('1.234,5 L');
  });

  it('when a tiny negative rounds to zero, then no minus sign is shown', () => {
    expect(formatVolume(-0.2, 'gal')).toBe('0 gal');
  });

  it('when formatting area and depth, then the unit is included', () => {
    expect(formatArea(12000, 'ft2')).toBe('12,000 ft²');
    expect(formatDepth(0.2, 'in')).toBe('0.20 in');
    expect(formatDepth(5.08, 'mm')).toBe('5.1 mm');
  });

  it('when the value is not finite, then it throws', () => {
    expect(() => formatVolume(Number.NaN, 'gal')).toThrow(RangeError);
  });
});
