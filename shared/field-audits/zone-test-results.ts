import { PRECIPITATION_RATE_CONSTANT } from '../budgets/run-time-advice';
import {
  auditedEfficiency,
  catchCanPrecipitationRate,
  catchDepthsIn,
  DU_TARGETS,
  lowQuarterUniformity,
  MIN_CANS_FOR_DU,
  rateUniformity,
  schedulingMultiplier,
} from './catch-can';
import type { ZoneTestInput, ZoneTestResults } from './field-audit-dto';

/** Everything a catch-can test says about one zone; throws RangeError when the catches can't be evaluated. */
export function zoneTestResults(
  test: Pick<ZoneTestInput, 'catches' | 'catchUnit' | 'throatDiameter' | 'throatUnit' | 'runMinutes' | 'headType'>,
  hydrozoneAreaFt2: number,
): ZoneTestResults {
  const throat =
    test.throatDiameter != null ? { diameter: test.throatDiameter, unit: test.throatUnit ?? 'in' } : undefined;
  const depths = catchDepthsIn(test.catches, test.catchUnit, throat);
  const uniformity = lowQuarterUniformity(depths);
  const prInPerHour = catchCanPrecipitationRate(depths, test.runMinutes);
  const duTarget = DU_TARGETS[test.headType] ?? 0.65;
  const warnings: string[] = [];
  if (depths.length < MIN_CANS_FOR_DU)
    warnings.push(`Only ${depths.length} cans: DU_lq rests on ${uniformity.lowQuarterCount} of them; use more cans.`);
  if (depths.some((d) => d === 0))
    warnings.push('Some cans caught nothing: check for a blocked or stuck head before trusting the figures.');
  if (prInPerHour > 2)
    warnings.push('Measured rate above 2 in/h: check the run time and the can throat entered (common practice).');
  return {
    meanDepthIn: uniformity.mean,
    prInPerHour,
    du: uniformity.du,
    lowQuarterCount: uniformity.lowQuarterCount,
    canCount: uniformity.count,
    schedulingMultiplier: schedulingMultiplier(uniformity.du),
    auditedEfficiency: auditedEfficiency(uniformity.du),
    duTarget,
    rating: rateUniformity(uniformity.du, duTarget),
    equivalentFlowGpm: (prInPerHour * hydrozoneAreaFt2) / PRECIPITATION_RATE_CONSTANT,
    warnings,
  };
}
