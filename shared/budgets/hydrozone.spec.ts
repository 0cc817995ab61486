import { describe, expect, it } from 'vitest';
import { effectiveIrrigationEfficiency, effectivePlantFactor, validateHydrozone, type Hydrozone } from './hydrozone';

// Invented zone.
const zone: Hydrozone = {
  id: 'z1',
  name: 'Front lawn',
  areaFt2: 1200,
  plantWaterUse: 'moderate',
  plantFactor: 0.5,
  irrigationMethod: 'spray',
  specialLandscapeArea: false,
};

describe('hydrozone validation', () => {
  it('when the zone is sound, then there are no issues', () => {
    expect(validateHydrozone(zone)).toEqual([]);
  });

  it('when the area is zero, then it says area must be > 0', () => {
    expect(validateHydrozone({ ...zone, areaFt2: 0 })).toEqual([
      { field: 'areaFt2', message: 'Area must be greater than 0 ft² (got 0)' },
    ]);
  });

  it('when the plant factor is outside 0..1 or outside its category, then it says which', () => {
    expect(validateHydrozone({ ...zone, plantFactor: 1.2 })[0]!.message).toBe(
      'Plant factor must be between 0 and 1 (got 1.2)',
    );
    expect(validateHydrozone({ ...zone, plantFactor: 0.3 })[0]!.message).toBe(
      'Plant factor 0.3 is outside the moderate range 0.4–0.6',
    );
  });

  it('when neither plant factor nor category is given, then it asks for one', () => {
    const { plantFactor: _pf, plantWaterUse: _c, ...bare } = zone;
    expect(validateHydrozone(bare)[0]!.message).toBe('Give a plant factor or a plant water-use category');
  });

  it('when the efficiency override is 0 or above 1, then it is rejected; 1 is allowed', () => {
    expect(validateHydrozone({ ...zone, efficiencyOverride: 0 })[0]!.field).toBe('efficiencyOverride');
    expect(validateHydrozone({ ...zone, efficiencyOverride: 1.01 })[0]!.field).toBe('efficiencyOverride');
    expect(validateHydrozone({ ...zone, efficiencyOverride: 1 })).toEqual([]);
  });

  it('uses the category default when only the category is known, and the override when present', () => {
    const { plantFactor: _pf, ...categoryOnly } = zone;
    expect(effectivePlantFactor(categoryOnly)).toBe(0.5);
    expect(effectivePlantFactor({ ...categoryOnly, plantWaterUse: 'low' })).toBe(0.2);
    expect(effectiveIrrigationEfficiency(zone).efficiency).toBe(0.75);
    expect(effectiveIrrigationEfficiency({ ...zone, irrigationMethod: 'drip' }).efficiency).toBe(0.81);
    expect(effectiveIrrigationEfficiency({ ...zone, efficiencyOverride: 0.68 })).toEqual({
      efficiency: 0.68,
      source: 'Entered for this hydrozone',
    });
  });
});
