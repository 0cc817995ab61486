import { describe, expect, it } from 'vitest';
import { auditSchedule, slopeBand } from './audit-schedule';

// Invented zone: 1.2 in/h measured, DU 0.6, plants use 1.0 in a week, the budget allows 1.5 in.
const base = { netWeeklyDepthIn: 1.0, budgetWeeklyDepthIn: 1.5, prInPerHour: 1.2, du: 0.6, daysPerWeek: 3 };

describe('audit schedule', () => {
  it('when the budget covers the need, then the schedule is the need: net ÷ PR × 60 × SM', () => {
    const s = auditSchedule(base);
    const sm = 1 / (0.4 + 0.6 * 0.6);
    expect(s.schedulingMultiplier).toBeCloseTo(sm, 12);
    expect(s.neededMinutesPerWeek).toBeCloseTo((1.0 / 1.2) * 60 * sm, 9);
    expect(s.budgetMinutesPerWeek).toBeCloseTo((1.5 / 1.2) * 60, 9);
    expect(s.budgetCoversNeed).toBe(true);
    expect(s.minutesPerWateringDay).toBeCloseTo(s.neededMinutesPerWeek / 3, 9);
    expect(s.cycleSoak).toBeNull();
  });

  it('when the budget is short, then it schedules the budget and says to fix uniformity first', () => {
    const s = auditSchedule({ ...base, du: 0.4, budgetWeeklyDepthIn: 1.1 });
    expect(s.budgetCoversNeed).toBe(false);
    expect(s.minutesPerWeek).toBeCloseTo(s.budgetMinutesPerWeek, 9);
    expect(s.cautions[0]).toMatch(/does not cover/);
  });

  it('when the soil is slow and sloped, then cycles shorten by the slope factor', () => {
    const flat = auditSchedule({ ...base, daysPerWeek: 1, soilIntakeInPerHour: 0.4, slopePercent: 2 });
    const steep = auditSchedule({ ...base, daysPerWeek: 1, soilIntakeInPerHour: 0.4, slopePercent: 10 });
    expect(flat.effectiveIntakeInPerHour).toBeCloseTo(0.4, 12);
    expect(steep.effectiveIntakeInPerHour).toBeCloseTo(0.24, 12);
    expect(steep.slopeLabel).toBe('8–12 %');
    expect(steep.cycleSoak!.cycles).toBeGreaterThan(flat.cycleSoak!.cycles);
    expect(steep.cycleSoak!.minutesPerCycle).toBeLessThanOrEqual((60 * 0.24) / 1.2 + 1e-9);
  });

  it('bands slopes', () => {
    expect(slopeBand(0).factor).toBe(1);
    expect(slopeBand(5).factor).toBe(1);
    expect(slopeBand(7).factor).toBe(0.8);
    expect(slopeBand(30).factor).toBe(0.4);
    expect(() => slopeBand(-1)).toThrow(/Slope/);
  });

  it('always carries the backflow and wiring caution', () => {
    expect(auditSchedule(base).cautions.join(' ')).toMatch(/backflow/);
  });
});
