import { describe, expect, it } from 'vitest';
import {
  adviseRunTime,
  dripZoneFlowGpm,
  planCycleSoak,
  precipitationRateInPerHour,
  runMinutesForDepth,
} from './run-time-advice';

// Invented zones; published PR examples are in test/reference/irrigation-formulas.test.ts.
describe('run-time advice', () => {
  it('drip flow: 40 × 1 gph + 12 × 2 gph = 64 gph = 1.0667 gpm', () => {
    expect(
      dripZoneFlowGpm([
        { count: 40, gallonsPerHour: 1 },
        { count: 12, gallonsPerHour: 2 },
      ]),
    ).toBeCloseTo(64 / 60, 12);
    expect(() => dripZoneFlowGpm([{ count: 2.5, gallonsPerHour: 1 }])).toThrow(/whole number/);
  });

  it('minutes for a depth: 1 in at 1.5 in/h is 40 minutes', () => {
    expect(runMinutesForDepth(1, 1.5)).toBeCloseTo(40, 12);
    expect(() => precipitationRateInPerHour(0, 100)).toThrow('Flow must be greater than 0 (got 0)');
  });

  it('cycle-and-soak with a maximum per cycle: 25 minutes at most 10 per cycle → 3 cycles of 8.33', () => {
    const plan = planCycleSoak(25, { maxMinutesPerCycle: 10 });
    expect(plan.cycles).toBe(3);
    expect(plan.minutesPerCycle).toBeCloseTo(25 / 3, 12);
  });

  it('cycle-and-soak from the soil: intake 0.5 in/h under PR 1.5 in/h allows 20-minute cycles', () => {
    expect(planCycleSoak(40, { soilIntakeInPerHour: 0.5, prInPerHour: 1.5 })).toMatchObject({
      cycles: 2,
      minutesPerCycle: 20,
    });
    expect(planCycleSoak(40, { soilIntakeInPerHour: 2, prInPerHour: 1.5 })).toMatchObject({
      cycles: 1,
      minutesPerCycle: 40,
    });
  });

  it('advice for a drip zone includes the pressure regulator and filter caution', () => {
    const advice = adviseRunTime({ weeklyDepthIn: 0.6, prInPerHour: 0.3, daysPerWeek: 3, isDrip: true });
    expect(advice.minutesPerWeek).toBeCloseTo(120, 12);
    expect(advice.minutesPerWateringDay).toBeCloseTo(40, 12);
    expect(advice.cautions.join(' ')).toMatch(/pressure regulator.*25–30 psi.*filter/);
    expect(advice.cautions.join(' ')).toMatch(/Backflow prevention/);
  });

  it('rejects watering days outside 1–7', () => {
    expect(() => adviseRunTime({ weeklyDepthIn: 1, prInPerHour: 1, daysPerWeek: 0, isDrip: false })).toThrow(/1–7/);
  });
});
