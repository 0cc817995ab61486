import { describe, expect, it } from 'vitest';
import { indoorAllotmentGallons } from './indoor-allotment';

describe('indoor allotment', () => {
  it('multiplies occupants, gallons per person per day and days', () => {
    // Invented: 4 people × 55 gal/person/day × 30 days = 6,600 gal.
    expect(indoorAllotmentGallons(4, 55, 30)).toBe(6600);
  });

  it('rejects negative inputs', () => {
    expect(() => indoorAllotmentGallons(-1, 55, 30)).toThrow('Occupants must be zero or more (got -1)');
  });
});
