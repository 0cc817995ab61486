import { planCycleSoak, type CycleSoakPlan } from '../budgets/run-time-advice';
import { schedulingMultiplier } from './catch-can';

/**
 * A zone's schedule after a catch-can test: how long it must run for the driest quarter to get what the plants
 * need, how long the water budget lets it run, and how to split a watering day into cycles the soil can take.
 */

/**
 * Share of the soil's intake rate usable on a slope, by slope band. The shape (full rate up to 5 %, then
 * less in steps to about 40 % above 12 %) follows design tables of maximum precipitation rate by soil and
 * slope — these factors are from memory, not from a published table; a measured intake rate on the slope wins.
 */
export const SLOPE_BANDS: readonly { upToPercent: number | null; factor: number; label: string }[] = [
  { upToPercent: 5, factor: 1, label: '0–5 %' },
  { upToPercent: 8, factor: 0.8, label: '5–8 %' },
  { upToPercent: 12, factor: 0.6, label: '8–12 %' },
  { upToPercent: null, factor: 0.4, label: 'over 12 %' },
];

export function slopeBand(slopePercent: number): { factor: number; label: string } {
  if (!Number.isFinite(slopePercent) || slopePercent < 0)
    throw new RangeError(`Slope must be zero or more percent (got ${slopePercent})`);
  return SLOPE_BANDS.find((b) => b.upToPercent === null || slopePercent <= b.upToPercent)!;
}

export interface AuditScheduleInput {
  /** What the plants use in a week: ETo × plant factor × 7 days, in (no irrigation losses). */
  netWeeklyDepthIn: number;
  /** What the water budget allows in a week (already divided by the zone's efficiency), in. */
  budgetWeeklyDepthIn: number;
  /** Measured precipitation rate, in/h. */
  prInPerHour: number;
  du: number;
  daysPerWeek: number;
  soilIntakeInPerHour?: number | null;
  slopePercent?: number | null;
}

export interface AuditSchedule {
  schedulingMultiplier: number;
  /** Run time for the driest quarter to get the plants' need: net ÷ PR × 60 × SM. */
  neededMinutesPerWeek: number;
  /** Run time the budget's depth takes at the measured rate: budget ÷ PR × 60. */
  budgetMinutesPerWeek: number;
  /** The lesser of the two: the schedule this audit proposes. */
  minutesPerWeek: number;
  minutesPerWateringDay: number;
  /** True when the budget covers what the driest quarter needs. */
  budgetCoversNeed: boolean;
  /** Soil intake after the slope factor, when given. */
  effectiveIntakeInPerHour: number | null;
  slopeLabel: string | null;
  cycleSoak: CycleSoakPlan | null;
  cautions: string[];
}

export function auditSchedule(input: AuditScheduleInput): AuditSchedule {
  const { prInPerHour, daysPerWeek } = input;
  if (!(prInPerHour > 0)) throw new RangeError(`Precipitation rate must be greater than 0 (got ${prInPerHour})`);
  if (!Number.isInteger(daysPerWeek) || daysPerWeek < 1 || daysPerWeek > 7)
    throw new RangeError(`Watering days per week must be a whole number 1–7 (got ${daysPerWeek})`);
  const sm = schedulingMultiplier(input.du);
  const neededMinutesPerWeek = (input.netWeeklyDepthIn / prInPerHour) * 60 * sm;
  const budgetMinutesPerWeek = (input.budgetWeeklyDepthIn / prInPerHour) * 60;
  const minutesPerWeek = Math.min(neededMinutesPerWeek, budgetMinutesPerWeek);
  const minutesPerWateringDay = minutesPerWeek / daysPerWeek;
  const band = input.slopePercent != null ? slopeBand(input.slopePercent) : null;
  const intake = input.soilIntakeInPerHour ?? null;
  const effectiveIntakeInPerHour = intake !== null ? intake * (band?.factor ?? 1) : null;
  const cycleSoak =
    effectiveIntakeInPerHour !== null
      ? planCycleSoak(minutesPerWateringDay, { soilIntakeInPerHour: effectiveIntakeInPerHour, prInPerHour })
      : null;
  return {
    schedulingMultiplier: sm,
    neededMinutesPerWeek,
    budgetMinutesPerWeek,
    minutesPerWeek,
    minutesPerWateringDay,
    budgetCoversNeed: budgetMinutesPerWeek + 1e-9 >= neededMinutesPerWeek,
    effectiveIntakeInPerHour,
    slopeLabel: band?.label ?? null,
    cycleSoak,
    cautions: scheduleCautions(input, budgetMinutesPerWeek + 1e-9 >= neededMinutesPerWeek),
  };
}

function scheduleCautions(input: AuditScheduleInput, covered: boolean): string[] {
  const cautions: string[] = [];
  if (!covered)
    cautions.push(
      'The budget does not cover what the driest quarter needs: raise uniformity (level and align heads, match ' +
        'nozzles, fix pressure) before adding minutes.',
    );
  if (input.soilIntakeInPerHour == null)
    cautions.push('No soil intake rate entered: watch for runoff and split the run into cycles if water puddles.');
  if ((input.slopePercent ?? 0) > 12)
    cautions.push('Steep slope: short cycles with a soak of an hour or more between them (common practice).');
  cautions.push(
    'Pressure work, backflow preventers and controller wiring follow local code; have licensed professionals ' +
      'install and test them.',
  );
  return cautions;
}
