import type { RunTimeAdviceDto } from '@shared/budgets/budget-dto';
import { adviseRunTime, dripZoneFlowGpm, precipitationRateInPerHour } from '@shared/budgets/run-time-advice';
import { zoneBudgetForPeriod, type BudgetWeatherDay } from '@shared/budgets/water-budget';
import { GALLONS_PER_INCH_SQUARE_FOOT } from '@shared/units/area-depth-units';
import { AppError } from '../../../platform/app-error';
import type { HydrozoneRecord } from '../../hydrozones/data/hydrozones-repository';
import { engineZone } from '../../hydrozones/domain/hydrozones-service';

const DRIP_METHODS = new Set(['drip', 'subsurface-drip']);

/**
 * Minutes per week for one hydrozone to apply its budget for `month`. The zone's flow comes from the hydrozone's
 * design gpm or its emitters (count × gph) until controller zones are imported. Rain is not credited here: the
 * advice is for a dry week, and a controller's rain pause handles wet ones.
 */
export function runTimeAdvice(
  zone: HydrozoneRecord,
  days: BudgetWeatherDay[],
  month: string,
  daysPerWeek: number,
): RunTimeAdviceDto {
  let flowGpm: number;
  let flowSource: string;
  if (zone.designFlowGpm !== null) {
    flowGpm = zone.designFlowGpm;
    flowSource = 'design flow entered for the hydrozone';
  } else if (zone.emitterCount !== null && zone.emitterGph !== null) {
    flowGpm = dripZoneFlowGpm([{ count: zone.emitterCount, gallonsPerHour: zone.emitterGph }]);
    flowSource = `${zone.emitterCount} emitters × ${zone.emitterGph} gph ÷ 60`;
  } else {
    throw new AppError(
      'validation_failed',
      `Hydrozone "${zone.name}" has no flow: enter its design flow ` +
        '(gpm), or its emitter count and flow per emitter (gph).',
      [{ field: 'designFlowGpm', message: 'enter the design flow, or the emitter count and gph' }],
    );
  }
  const budget = zoneBudgetForPeriod(engineZone(zone), days, { kind: 'none' });
  // The budget is already gross (÷ IE), so its depth over the area is what the heads must put down.
  const monthDepthIn = budget.gallons / (zone.areaFt2 * GALLONS_PER_INCH_SQUARE_FOOT);
  const weeklyDepthIn = (monthDepthIn * 7) / days.length;
  const prInPerHour = precipitationRateInPerHour(flowGpm, zone.areaFt2);
  const isDrip = DRIP_METHODS.has(zone.irrigationMethod);
  let advice;
  try {
    advice = adviseRunTime({
      weeklyDepthIn,
      prInPerHour,
      daysPerWeek,
      isDrip,
      cycleLimit:
        zone.soilIntakeInPerHour !== null ? { soilIntakeInPerHour: zone.soilIntakeInPerHour, prInPerHour } : undefined,
    });
  } catch (error) {
    throw AppError.invalid('daysPerWeek', (error as Error).message);
  }
  return {
    zoneId: zone.id,
    zoneName: zone.name,
    month,
    daysPerWeek,
    isDrip,
    flowGpm,
    flowSource,
    prInPerHour,
    weeklyDepthIn,
    minutesPerWeek: advice.minutesPerWeek,
    minutesPerWateringDay: advice.minutesPerWateringDay,
    cycleSoak: advice.cycleSoak,
    cautions: advice.cautions,
    steps: [
      { label: 'Zone flow', formula: flowSource, value: flowGpm, unit: 'gpm' },
      {
        label: 'Precipitation rate',
        formula: `96.25 × ${flowGpm.toFixed(2)} gpm ÷ ${Math.round(zone.areaFt2)} ft²`,
        value: prInPerHour,
        unit: 'in/h',
      },
      {
        label: 'Budget for the month (no rain credit)',
        formula: 'Σ daily ETo (in) × PF × area × 0.623377 ÷ IE',
        value: budget.gallons,
        unit: 'gal',
      },
      {
        label: 'Weekly depth to apply',
        formula: `budget ÷ (area × 0.623377) × 7 ÷ ${days.length} days`,
        value: weeklyDepthIn,
        unit: 'in',
      },
      {
        label: 'Minutes per week',
        formula: 'weekly depth ÷ precipitation rate × 60',
        value: advice.minutesPerWeek,
        unit: 'min',
      },
      {
        label: 'Minutes per watering day',
        formula: `minutes per week ÷ ${daysPerWeek} days`,
        value: advice.minutesPerWateringDay,
        unit: 'min',
      },
    ],
  };
}
