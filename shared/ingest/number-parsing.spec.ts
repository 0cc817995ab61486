import { describe, expect, it } from 'vitest';
import { parseNumber, parseVolume } from './number-parsing';

describe('parseNumber', () => {
  it.each([
    ['1,234.5', 1234.5],
    ['1,234,567', 1234567],
    ['1234.5', 1234.5],
    [' 42 ', 42],
    ['.5', 0.5],
    ['-3.25', -3.25],
    ['0043', 43],
  ])('reads %s as %d with a decimal point', (text, value) => {
    expect(parseNumber(text)).toEqual({ ok: true, value });
  });

  it.each([
    ['1.234,5', 1234.5],
    ['1,25', 1.25],
    ['1.234.567', 1234567],
    ['12', 12],
  ])('reads %s as %d when the mapping says decimal comma', (text, value) => {
    expect(parseNumber(text, { decimalComma: true })).toEqual({ ok: true, value });
  });

  it('when "1.234,5" appears without the decimal-comma setting, then it is not a number', () => {
    expect(parseNumber('1.234,5').ok).toBe(false);
  });

  it('when "1,25" appears without the decimal-comma setting, then the message suggests the setting', () => {
    const result = parseNumber('1,25');
    expect(result.ok).toBe(false);
    expect(!result.ok && result.message).toMatch(/decimal comma/);
  });

  it.each(['1,23', 'abc', '12 gal', '1e3', '', 'n/a', '--1'])('rejects %j', (text) => {
    expect(parseNumber(text).ok).toBe(false);
  });
});

describe('parseVolume', () => {
  it('when negative, then rejected with the reason', () => {
    const result = parseVolume('-12.5');
    expect(result).toEqual({ ok: false, message: '-12.5 is negative; a volume cannot be below zero' });
  });

  it('when non-numeric, then rejected naming the text', () => {
    expect(parseVolume('n/a')).toEqual({ ok: false, message: '"n/a" is not a number' });
  });

  it('when zero, then accepted', () => {
    expect(parseVolume('0')).toEqual({ ok: true, value: 0 });
  });
});
