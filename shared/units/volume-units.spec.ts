import { describe, expect, it } from 'vitest';
import { GALLONS_PER_UNIT, VOLUME_UNITS, convertVolume, fromGallons, parseVolumeUnit, toGallons } from './volume-units';

describe('volume units', () => {
  it('when a volume goes to every unit and back, then it is unchanged', () => {
    for (const from of VOLUME_UNITS) {
      for (const to of VOLUME_UNITS) {
        expect(convertVolume(convertVolume(123.456, from, to), to, from)).toBeCloseTo(123.456, 9);
      }
    }
  });

  it('when converting CCF to cubic feet, then it is exactly 100', () => {
    expect(convertVolume(1, 'ccf', 'ft3')).toBeCloseTo(100, 12);
  });

  it('when converting kgal to gallons, then it multiplies by 1000', () => {
    expect(toGallons(2.5, 'kgal')).toBe(2500);
    expect(fromGallons(2500, 'kgal')).toBe(2.5);
  });

  it('when converting 1 m³ to litres, then it is 1000 L', () => {
    expect(convertVolume(1, 'm3', 'l')).toBeCloseTo(1000, 9);
  });

  it('when an acre-foot is expressed in acre-inches, then it is 12', () => {
    expect(GALLONS_PER_UNIT['acre-ft'] / GALLONS_PER_UNIT['acre-in']).toBeCloseTo(12, 12);
  });

  it('when parsing common spellings, then they map to unit ids', () => {
    expect(parseVolumeUnit('HCF')).toBe('ccf');
    expect(parseVolumeUnit(' Gallons ')).toBe('gal');
    expect(parseVolumeUnit('m³')).toBe('m3');
    expect(() => parseVolumeUnit('bushel')).toThrow(/Unknown volume unit "bushel"/);
  });
});
