import { fromGallons } from '../units/volume-units';
import { validateRateSchedule, type RateSchedule } from './rate-schedule';

/** One line of a bill: how many billing units were charged at which price. */
export interface CostLine {
  label: string;
  units: number;
  pricePerUnit: number;
  amount: number;
}

export interface WaterCost {
  /** Volume in billing units. */
  units: number;
  fixedCharge: number;
  volumeCharge: number;
  total: number;
  lines: CostLine[];
}

/** Rounds money to cents once, at the end, so the lines add up to the unrounded total. */
export function roundToCents(amount: number): number {
  return Math.round((amount + Number.EPSILON * Math.sign(amount)) * 100) / 100;
}

function assertValid(schedule: RateSchedule): void {
  const problems = validateRateSchedule(schedule);
  if (problems.length > 0) throw new RangeError(`Rate schedule "${schedule.name}": ${problems.join('; ')}`);
}

/** Fills tiers bottom-up: each tier takes the units between the previous bound and its own. */
function fillTiers(units: number, tiers: { upTo: number | null; price: number; label: string }[]): CostLine[] {
  const lines: CostLine[] = [];
  let lower = 0;
  for (const tier of tiers) {
    const upper = tier.upTo ?? Number.POSITIVE_INFINITY;
    const inTier = Math.max(0, Math.min(units, upper) - lower);
    if (inTier > 0)
      lines.push({ label: tier.label, units: inTier, pricePerUnit: tier.price, amount: inTier * tier.price });
    lower = upper;
    if (units <= upper) break;
  }
  return lines;
}

/**
 * Cost of `volumeGal` over one billing period. Budget-based schedules need the period's `budgetGal`.
 * Amounts are not rounded except `total`, which is rounded to cents.
 */
export function costOfVolume(schedule: RateSchedule, volumeGal: number, budgetGal?: number): WaterCost {
  assertValid(schedule);
  if (!(volumeGal >= 0)) throw new RangeError(`Volume must be zero or more (got ${volumeGal} gal)`);
  const units = fromGallons(volumeGal, schedule.unit);
  const charge = schedule.volumeCharge;
  let lines: CostLine[];
  switch (charge.kind) {
    case 'uniform':
      lines =
        units > 0
          ? [{ label: 'Uniform rate', units, pricePerUnit: charge.pricePerUnit, amount: units * charge.pricePerUnit }]
          : [];
      break;
    case 'tiered':
      lines = fillTiers(
        units,
        charge.tiers.map((t, i) => ({ upTo: t.upToUnits, price: t.pricePerUnit, label: `Tier ${i + 1}` })),
      );
      break;
    case 'budget-based': {
      if (budgetGal === undefined || !(budgetGal >= 0)) {
        throw new RangeError("A budget-based rate needs the period's water budget (zero or more gallons)");
      }
      const budgetUnits = fromGallons(budgetGal, schedule.unit);
      lines = fillTiers(
        units,
        charge.tiers.map((t, i) => ({
          upTo: t.upToPercentOfBudget === null ? null : (budgetUnits * t.upToPercentOfBudget) / 100,
          price: t.pricePerUnit,
          label:
            t.upToPercentOfBudget === null
              ? `Tier ${i + 1} (above budget tiers)`
              : `Tier ${i + 1} (to ${t.upToPercentOfBudget} % of budget)`,
        })),
      );
      break;
    }
  }
  const volumeCharge = lines.reduce((sum, line) => sum + line.amount, 0);
  return {
    units,
    fixedCharge: schedule.fixedChargePerPeriod,
    volumeCharge,
    total: roundToCents(schedule.fixedChargePerPeriod + volumeCharge),
    lines,
  };
}

/** What the period would cost if the site used exactly its budget. */
export function costOfBudget(schedule: RateSchedule, budgetGal: number): WaterCost {
  return costOfVolume(schedule, budgetGal, budgetGal);
}

export interface GapCost {
  /** Actual − budget, gallons; negative when under budget. */
  gapGal: number;
  actual: WaterCost;
  budget: WaterCost;
  /** Cost(actual) − cost(budget), cents-rounded; negative means money saved against the budget. */
  gapCost: number;
}

/**
 * The cost of the difference between actual use and budget: the extra (or saved) money, priced at the tiers the
 * difference actually falls in, since the fixed charge is the same either way.
 */
export function costOfGap(schedule: RateSchedule, actualGal: number, budgetGal: number): GapCost {
  const actual = costOfVolume(schedule, actualGal, budgetGal);
  const budget = costOfVolume(schedule, budgetGal, budgetGal);
  return { gapGal: actualGal - budgetGal, actual, budget, gapCost: roundToCents(actual.total - budget.total) };
}
