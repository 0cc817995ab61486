import { addMonths } from '../portfolio/period';
import type { SavingsChangeKind, SavingsProjectInput } from '../savings/savings-project-dto';
import type { CarryOutInput, PlanInput } from './plan-dto';

/**
 * The savings project a carried-out plan becomes: the 12 months before the install month as baseline and the 12
 * after it as reporting period (the install month itself is neither), unless the user chose other months.
 */
export function savingsProjectFor(
  plan: Pick<PlanInput, 'title' | 'notes' | 'zoneChanges'> & {
    smartControllerReductionPercent?: number | null;
    rainSensor?: boolean;
    changeSummary: string[];
  },
  input: CarryOutInput,
): SavingsProjectInput {
  const installMonth = input.installedOn.slice(0, 7);
  const description = [plan.notes?.trim(), ...plan.changeSummary].filter(Boolean).join(' · ');
  return {
    title: plan.title,
    changeKind: changeKindOf(plan),
    changeDescription: `Carried out from what-if plan. ${description}`.slice(0, 2000),
    installedOn: input.installedOn,
    baselineFrom: input.baselineFrom ?? addMonths(installMonth, -12),
    baselineTo: input.baselineTo ?? addMonths(installMonth, -1),
    reportingFrom: input.reportingFrom ?? addMonths(installMonth, 1),
    reportingTo: input.reportingTo ?? addMonths(installMonth, 12),
    modelForm: 'eto',
  };
}

/** The savings kind that names the plan's main change. */
export function changeKindOf(plan: {
  zoneChanges: PlanInput['zoneChanges'];
  smartControllerReductionPercent?: number | null;
  rainSensor?: boolean;
}): SavingsChangeKind {
  const changes = plan.zoneChanges;
  if (changes.some((c) => c.irrigationMethod === 'drip' || c.irrigationMethod === 'subsurface-drip'))
    return 'spray-to-drip';
  if (changes.some((c) => c.plantFactor != null || c.areaRemovedFt2 != null)) return 'replanting';
  if ((plan.smartControllerReductionPercent ?? 0) > 0 || plan.rainSensor) return 'controller-replacement';
  return 'other';
}
