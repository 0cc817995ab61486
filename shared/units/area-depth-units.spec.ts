import { describe, expect, it } from 'vitest';
import { convertArea, convertDepth, depthToGallons, depthToLitres, inchesToMm, mmToInches } from './area-depth-units';
import { LITRES_PER_GALLON } from './volume-units';

describe('area and depth units', () => {
  it('when converting inches and millimetres, then 1 in is 25.4 mm both ways', () => {
    expect(inchesToMm(2)).toBe(50.8);
    expect(mmToInches(50.8)).toBeCloseTo(2, 12);
    expect(convertDepth(1, 'in', 'mm')).toBe(25.4);
    expect(convertDepth(25.4, 'mm', 'in')).toBeCloseTo(1, 12);
  });

  it('when converting an acre to m², then it equals 43,560 × 0.3048²', () => {
    expect(convertArea(1, 'acre', 'm2')).toBeCloseTo(43_560 * 0.09290304, 6);
    expect(convertArea(convertArea(5000, 'ft2', 'm2'), 'm2', 'ft2')).toBeCloseTo(5000, 9);
  });

  it('when the same layer of water is computed in US and metric units, then the volumes agree', () => {
    // Invented example: 0.5 in over 2,000 ft².
    const gallons = depthToGallons(0.5, 2000);
    const litres = depthToLitres(inchesToMm(0.5), convertArea(2000, 'ft2', 'm2'));
    expect(litres / LITRES_PER_GALLON).toBeCloseTo(gallons, 6);
  });
});
