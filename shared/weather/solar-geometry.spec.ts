import { describe, expect, it } from 'vitest';
import {
  daylightHours,
  degreesToRadians,
  extraterrestrialRadiationDailyMj,
  extraterrestrialRadiationPeriod,
  sunsetHourAngleRad,
  solarDeclinationRad,
} from './solar-geometry';

describe('solar geometry', () => {
  it('when summed over 24 hourly periods, then Ra equals the daily Ra', () => {
    const phi = degreesToRadians(38);
    const daily = extraterrestrialRadiationDailyMj(phi, 172);
    let sum = 0;
    for (let hour = 0; hour < 24; hour++)
      sum += extraterrestrialRadiationPeriod(phi, 172, (Math.PI / 12) * (hour + 0.5 - 12)).raMj;
    expect(sum).toBeCloseTo(daily, 6);
  });

  it('when the sun never sets or never rises, then ωs is π or 0 and N is 24 or 0', () => {
    const june = 172;
    const phi = degreesToRadians(80);
    expect(sunsetHourAngleRad(phi, solarDeclinationRad(june))).toBeCloseTo(Math.PI, 12);
    expect(daylightHours(phi, june)).toBeCloseTo(24, 9);
    expect(daylightHours(-phi, june)).toBe(0);
  });

  it('at the equinox day length is about 12 h everywhere', () => {
    for (const lat of [-45, 0, 30, 60])
      expect(Math.abs(daylightHours(degreesToRadians(lat), 80) - 12)).toBeLessThan(0.3);
  });
});
