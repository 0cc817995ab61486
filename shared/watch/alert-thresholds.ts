/**
 * Every number the nightly watch decides with, in one place, each with the words the settings page shows.
 * Sites override any of them; the rest fall back to these defaults. Values marked "common practice, no source"
 * are trade rules of thumb, not published figures.
 */

export interface ThresholdSpec {
  value: number;
  unit: string;
  /** Plain words for the UI: what the number does, not how the code uses it. */
  explanation: string;
}

export const DEFAULT_THRESHOLDS = {
  // Lining up the controller's clock with the meter's
  controllerClockSearchMinutes: {
    value: 15,
    unit: 'min',
    explanation:
      'Controller clocks drift; the watch looks this many minutes either ' +
      'way for the shift that best lines runs up with metered water (0 turns it off).',
  },
  // Leak: continuous flow
  continuousFlowHours: {
    value: 24,
    unit: 'h',
    explanation:
      'Flag a leak when the meter shows flow in every hour for at least ' +
      'this long (interval-meter rule of thumb; common practice, no source).',
  },
  continuousFlowMinGph: {
    value: 0,
    unit: 'gal/h',
    explanation: 'An hour counts as "flowing" when the meter moved more than this.',
  },
  // Leak: minimum night flow
  nightStartHour: {
    value: 1,
    unit: 'local hour',
    explanation: 'Start of the quiet night hours used to measure the lowest overnight flow.',
  },
  nightEndHour: {
    value: 5,
    unit: 'local hour',
    explanation: 'End of the quiet night hours (the hour itself is not included).',
  },
  nightMinQuietHours: {
    value: 2,
    unit: 'h',
    explanation: 'A night is only judged when at least this many night hours had no zone running.',
  },
  nightBaselineNights: {
    value: 28,
    unit: 'nights',
    explanation: "How many earlier normal nights make up the site's own night-flow baseline.",
  },
  nightMinBaselineNights: {
    value: 10,
    unit: 'nights',
    explanation: 'No night-flow flag until the site has at least this many normal nights on record.',
  },
  nightFlowMadK: {
    value: 4,
    unit: '× spread',
    explanation:
      'A night is high when its lowest flow is more than this many ' +
      "spreads (scaled MAD) above the site's usual lowest flow.",
  },
  nightFlowMinExcessGph: {
    value: 3,
    unit: 'gal/h',
    explanation:
      'Ignore night flow rises smaller than this, however steady the baseline (0.05 gpm; common practice, no source).',
  },
  nightFlowMinNights: {
    value: 2,
    unit: 'nights',
    explanation: 'Flag elevated night flow only after this many high nights in a row.',
  },
  // Leak: monthly reads
  monthlyLeakRatio: {
    value: 1.5,
    unit: '× budget',
    explanation:
      'For sites read once a month: a month using this many times its ' +
      'budget or more is flagged as a likely leak (common practice, no source).',
  },
  // Runaway zone: over-volume
  overVolumeRatio: {
    value: 1.5,
    unit: '× design',
    explanation:
      'A zone run that used this many times its design flow × minutes or more is flagged (common practice, no source).',
  },
  overVolumeMinExcessGal: {
    value: 30,
    unit: 'gal',
    explanation: 'Ignore over-volume smaller than this per run; meters round and flows wobble.',
  },
  overVolumeHourTolerance: {
    value: 0.2,
    unit: 'share',
    explanation:
      'With only the site meter, an hour of watering counts as normal ' +
      'within this share of design (design flows on record are often ' +
      '15–20 % off; common practice, no source). Extra water is pinned ' +
      'on a zone only when its own hours are heavier than this and ' +
      "the watering's other hours are not.",
  },
  overVolumeMinRuns: {
    value: 2,
    unit: 'runs',
    explanation: 'Flag a zone for over-volume after this many heavy runs in a row.',
  },
  // Runaway zone: long runs
  longRunMadK: {
    value: 5,
    unit: '× spread',
    explanation:
      "A run is long when it exceeds the zone's usual run by more than " +
      'this many spreads (scaled MAD) of its recent runs.',
  },
  longRunMinRatio: {
    value: 1.5,
    unit: '× usual',
    explanation:
      "A run must also be at least this many times the zone's usual " +
      'run to count as long, so weather-driven changes are not flagged.',
  },
  longRunHistoryRuns: {
    value: 30,
    unit: 'runs',
    explanation: 'How many earlier scheduled runs of the zone make up its usual run.',
  },
  longRunMinHistoryRuns: {
    value: 8,
    unit: 'runs',
    explanation: 'No long-run flag against history until the zone has this many earlier runs.',
  },
  longRunScheduleRatio: {
    value: 1.5,
    unit: '× schedule',
    explanation: "When the zone's programmed minutes are known, a run this many times longer is flagged.",
  },
  // Runaway zone: valve open with nothing scheduled
  openValveShareOfSmallestZone: {
    value: 0.5,
    unit: '× smallest zone flow',
    explanation:
      'Extra flow with no zone running, at this share of the smallest ' +
      "zone's design flow or more, is checked for a valve stuck open.",
  },
  openValveDesignTolerance: {
    value: 0.25,
    unit: 'share',
    explanation:
      'A valve is blamed only when the extra water starts as a run ends and flows within this share of that ' +
      "zone's design flow (design flows on record are often 15–20 % off; common practice, no source).",
  },
  openValveMinHours: {
    value: 2,
    unit: 'h',
    explanation: 'Flag an open valve after this many hours of such flow with no zone running.',
  },
  // Overspend
  overspendMinDays: {
    value: 7,
    unit: 'days',
    explanation: "Judge a month's pace only from this day of the month on; the first days say too little.",
  },
  monthToDateRatio: {
    value: 1.1,
    unit: '× prorated budget',
    explanation: 'Flag when use so far this month is this many times the budget for the days so far.',
  },
  projectedRatio: {
    value: 1.1,
    unit: '× monthly budget',
    explanation: 'Flag when the month, at the recent pace, would end this many times over its budget.',
  },
  projectionRecentDays: {
    value: 14,
    unit: 'days',
    explanation:
      'The recent pace is the average daily use over this many latest ' +
      'days of the month; two whole weeks, so every-other-day and weekly ' +
      'schedules do not swing it. The month-end projection is judged ' +
      'from this day of the month on.',
  },
  // Silent meter
  silentHours: {
    value: 48,
    unit: 'h',
    explanation: 'Flag a meter that sent no readings for this long.',
  },
  zeroFlowMinExpectedGal: {
    value: 100,
    unit: 'gal',
    explanation: 'Judge a day for "zero while zones ran" only when the runs should have used at least this much.',
  },
  zeroFlowMaxShare: {
    value: 0.05,
    unit: 'share',
    explanation:
      'A day counts as zero-flow when the meter shows less than this share of what the runs should have used.',
  },
  zeroFlowMinDays: {
    value: 2,
    unit: 'days',
    explanation: 'Flag a broken or bypassed meter after this many such watering days in a row.',
  },
  // Severity
  severityActSoonShare: {
    value: 0.1,
    unit: '× daily budget',
    explanation: 'Waste above this share of the site\'s average daily budget is marked "act soon".',
  },
  severityActNowShare: {
    value: 0.5,
    unit: '× daily budget',
    explanation: 'Waste above this share of the site\'s average daily budget is marked "act now".',
  },
} as const satisfies Record<string, ThresholdSpec>;

export type ThresholdName = keyof typeof DEFAULT_THRESHOLDS;
export type AlertThresholds = Record<ThresholdName, number>;

const HOUR_NAMES: ReadonlySet<ThresholdName> = new Set(['nightStartHour', 'nightEndHour']);

/** Defaults with the site's overrides applied; throws a RangeError naming a bad override. */
export function resolveThresholds(overrides: Partial<AlertThresholds> = {}): AlertThresholds {
  const resolved = {} as AlertThresholds;
  for (const name of Object.keys(DEFAULT_THRESHOLDS) as ThresholdName[]) {
    const value = overrides[name] ?? DEFAULT_THRESHOLDS[name].value;
    if (!Number.isFinite(value) || value < 0)
      throw new RangeError(`Threshold ${name} must be a number, zero or more (got ${value})`);
    if (HOUR_NAMES.has(name) && (!Number.isInteger(value) || value > 23))
      throw new RangeError(`Threshold ${name} must be a whole hour 0–23 (got ${value})`);
    resolved[name] = value;
  }
  return resolved;
}
