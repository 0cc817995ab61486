/**
 * Water rate schedules, as utilities publish them: a fixed charge per billing period plus a volume charge that
 * is uniform, tiered by volume (increasing block), or tiered by share of the site's water budget.
 * Prices are in currency units (e.g. USD) per billing unit.
 */

export const BILLING_UNITS = ['ccf', 'kgal'] as const;
export type BillingUnit = (typeof BILLING_UNITS)[number];

export interface VolumeTier {
  /** Upper bound of the tier in billing units for the period; null for the last, open-ended tier. */
  upToUnits: number | null;
  pricePerUnit: number;
}

export interface BudgetTier {
  /** Upper bound as a percentage of the period's water budget (100 = the budget); null for the last tier. */
  upToPercentOfBudget: number | null;
  pricePerUnit: number;
}

export type VolumeCharge =
  | { kind: 'uniform'; pricePerUnit: number }
  | { kind: 'tiered'; tiers: VolumeTier[] }
  | { kind: 'budget-based'; tiers: BudgetTier[] };

export interface RateSchedule {
  name: string;
  unit: BillingUnit;
  currency: string;
  /** Charge per billing period whatever the use (meter / service charge). */
  fixedChargePerPeriod: number;
  volumeCharge: VolumeCharge;
}

function checkTierBounds(bounds: (number | null)[], label: string, problems: string[]): void {
  if (bounds.length === 0) {
    problems.push('Tiered rates need at least one tier');
    return;
  }
  bounds.forEach((bound, i) => {
    const isLast = i === bounds.length - 1;
    if (isLast && bound !== null) problems.push(`The last tier must be open-ended (no upper ${label})`);
    if (!isLast && bound === null)
      problems.push(`Tier ${i + 1} needs an upper ${label}; only the last tier is open-ended`);
    if (bound !== null) {
      if (!(bound > 0)) problems.push(`Tier ${i + 1} upper ${label} must be greater than 0`);
      const previous = i > 0 ? bounds[i - 1] : null;
      if (previous != null && bound <= previous)
        problems.push(`Tier ${i + 1} upper ${label} must be above tier ${i}'s`);
    }
  });
}

/** Every problem with a schedule; empty when valid. */
export function validateRateSchedule(schedule: RateSchedule): string[] {
  const problems: string[] = [];
  if (!BILLING_UNITS.includes(schedule.unit)) problems.push(`Unknown billing unit "${schedule.unit}"`);
  if (!(schedule.fixedChargePerPeriod >= 0)) problems.push('Fixed charge must be zero or more');
  const charge = schedule.volumeCharge;
  const prices = charge.kind === 'uniform' ? [charge.pricePerUnit] : charge.tiers.map((tier) => tier.pricePerUnit);
  prices.forEach((price, i) => {
    if (!(price >= 0) || !Number.isFinite(price)) problems.push(`Price ${i + 1} must be zero or more`);
  });
  if (charge.kind === 'tiered')
    checkTierBounds(
      charge.tiers.map((t) => t.upToUnits),
      'bound (units)',
      problems,
    );
  if (charge.kind === 'budget-based')
    checkTierBounds(
      charge.tiers.map((t) => t.upToPercentOfBudget),
      'bound (% of budget)',
      problems,
    );
  return problems;
}
