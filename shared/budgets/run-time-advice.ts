import { GALLONS_PER_CUBIC_FOOT } from '../units/volume-units';

/**
 * Run-time advice per zone: precipitation rate, minutes per week and cycle-and-soak.
 * Depths in inches, flows in US gpm (drip emitters in gph), areas in ft².
 */

/** 96.25 = 60 min/h × 12 in/ft ÷ 7.480519 gal/ft³ (exactly 96.25, since 720 × 231/1728 = 96.25). */
export const PRECIPITATION_RATE_CONSTANT = (60 * 12) / GALLONS_PER_CUBIC_FOOT;

function requirePositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) throw new RangeError(`${name} must be greater than 0 (got ${value})`);
}

/** Area-based precipitation rate PR = 96.25 × total gpm ÷ area, in/h. */
export function precipitationRateInPerHour(totalGpm: number, areaFt2: number): number {
  requirePositive('Flow', totalGpm);
  requirePositive('Area', areaFt2);
  return (PRECIPITATION_RATE_CONSTANT * totalGpm) / areaFt2;
}

/**
 * Head-to-head spacing PR from the flow of a full-circle head: square 96.25·gpm/(S·L), triangular
 * 96.25·gpm/(S·L·0.866), the rows of a triangle being closer by √3/2.
 */
export function spacingPrecipitationRateInPerHour(
  fullCircleGpm: number,
  headSpacingFt: number,
  rowSpacingFt: number,
  pattern: 'square' | 'triangular',
): number {
  requirePositive('Full-circle flow', fullCircleGpm);
  requirePositive('Head spacing', headSpacingFt);
  requirePositive('Row spacing', rowSpacingFt);
  const area = headSpacingFt * rowSpacingFt * (pattern === 'triangular' ? 0.866 : 1);
  return (PRECIPITATION_RATE_CONSTANT * fullCircleGpm) / area;
}

export interface EmitterGroup {
  count: number;
  gallonsPerHour: number;
}

/** Zone flow of a drip zone, gpm: Σ count × gph ÷ 60. */
export function dripZoneFlowGpm(emitters: readonly EmitterGroup[]): number {
  if (emitters.length === 0) throw new RangeError('A drip zone needs at least one emitter group');
  return emitters.reduce((sum, group, i) => {
    if (!Number.isInteger(group.count) || group.count <= 0)
      throw new RangeError(`Emitter group ${i + 1}: count must be a whole number above 0`);
    requirePositive(`Emitter group ${i + 1} flow`, group.gallonsPerHour);
    return sum + (group.count * group.gallonsPerHour) / 60;
  }, 0);
}

/** Minutes of run time to apply `depthIn` at `prInPerHour`. */
export function runMinutesForDepth(depthIn: number, prInPerHour: number): number {
  if (!(depthIn >= 0)) throw new RangeError(`Depth must be zero or more (got ${depthIn})`);
  requirePositive('Precipitation rate', prInPerHour);
  return (depthIn / prInPerHour) * 60;
}

export interface CycleSoakPlan {
  totalMinutes: number;
  cycles: number;
  minutesPerCycle: number;
  /** How the per-cycle limit was set. */
  limitSource: string;
}

/**
 * Splits a run time into equal cycles no longer than the limit. The limit is either given, or taken from the
 * soil: when PR exceeds the intake rate, one cycle applies no more than the soil takes in an hour
 * (maxMinutes = 60 × intake ÷ PR). Common practice, no source; slopes and compacted soil need shorter cycles.
 */
export function planCycleSoak(
  totalMinutes: number,
  limit: { maxMinutesPerCycle: number } | { soilIntakeInPerHour: number; prInPerHour: number },
): CycleSoakPlan {
  if (!(totalMinutes >= 0)) throw new RangeError(`Run time must be zero or more (got ${totalMinutes})`);
  let maxMinutes: number;
  let limitSource: string;
  if ('maxMinutesPerCycle' in limit) {
    requirePositive('Maximum minutes per cycle', limit.maxMinutesPerCycle);
    maxMinutes = limit.maxMinutesPerCycle;
    limitSource = 'entered maximum minutes per cycle';
  } else {
    requirePositive('Soil intake rate', limit.soilIntakeInPerHour);
    requirePositive('Precipitation rate', limit.prInPerHour);
    if (limit.soilIntakeInPerHour >= limit.prInPerHour) {
      return {
        totalMinutes,
        cycles: totalMinutes > 0 ? 1 : 0,
        minutesPerCycle: totalMinutes,
        limitSource: 'soil takes water faster than it is applied: one cycle',
      };
    }
    maxMinutes = (60 * limit.soilIntakeInPerHour) / limit.prInPerHour;
    limitSource = 'soil intake rate ÷ precipitation rate × 60 (common practice, no source)';
  }
  const cycles = totalMinutes > 0 ? Math.ceil(totalMinutes / maxMinutes - 1e-9) : 0;
  return { totalMinutes, cycles, minutesPerCycle: cycles > 0 ? totalMinutes / cycles : 0, limitSource };
}

export interface RunTimeAdviceInput {
  weeklyDepthIn: number;
  prInPerHour: number;
  /** Watering days per week the schedule allows. */
  daysPerWeek: number;
  isDrip: boolean;
  cycleLimit?: { maxMinutesPerCycle: number } | { soilIntakeInPerHour: number; prInPerHour: number };
}

export interface RunTimeAdvice {
  minutesPerWeek: number;
  minutesPerWateringDay: number;
  cycleSoak: CycleSoakPlan | null;
  cautions: string[];
}

/** Minutes per week and per watering day for a weekly gross depth, with cycle-and-soak and cautions. */
export function adviseRunTime(input: RunTimeAdviceInput): RunTimeAdvice {
  if (!Number.isInteger(input.daysPerWeek) || input.daysPerWeek < 1 || input.daysPerWeek > 7) {
    throw new RangeError(`Watering days per week must be a whole number 1–7 (got ${input.daysPerWeek})`);
  }
  const minutesPerWeek = runMinutesForDepth(input.weeklyDepthIn, input.prInPerHour);
  const minutesPerWateringDay = minutesPerWeek / input.daysPerWeek;
  const cycleSoak = input.cycleLimit ? planCycleSoak(minutesPerWateringDay, input.cycleLimit) : null;
  const cautions = [
    'Backflow prevention and controller wiring follow local code; have licensed professionals install and test them.',
  ];
  if (input.isDrip) {
    cautions.unshift(
      'Drip zones usually need a pressure regulator (around 25–30 psi) ' +
        'and a filter upstream of the emitters (common practice, no source).',
    );
  } else if (input.prInPerHour > 1) {
    cautions.unshift(
      'Precipitation rate above 1 in/h: expect runoff on most soils ' +
        'unless run in short cycles (common practice, no source).',
    );
  }
  return { minutesPerWeek, minutesPerWateringDay, cycleSoak, cautions };
}
