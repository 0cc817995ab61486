import { KIND_LABELS } from '@shared/alerts/alert-dto';
import type { ThresholdName } from '@shared/watch/alert-thresholds';
import { LITRES_PER_GALLON } from '@shared/units/volume-units';

/**
 * How the watch settings page shows each threshold: grouped by the alert it tunes, a plain name and help text, and
 * its unit in the organisation's system. Code names and provenance notes stay in shared/watch/alert-thresholds.ts.
 */
export interface ThresholdText {
  label: string;
  help: string;
}

export const THRESHOLD_GROUPS: { title: string; intro: string; names: ThresholdName[] }[] = [
  {
    title: KIND_LABELS.leak,
    intro: 'Water that keeps running: every hour for a day or more, or more than usual in the quiet night hours.',
    names: [
      'continuousFlowHours',
      'continuousFlowMinGph',
      'nightStartHour',
      'nightEndHour',
      'nightMinQuietHours',
      'nightBaselineNights',
      'nightMinBaselineNights',
      'nightFlowMadK',
      'nightFlowMinExcessGph',
      'nightFlowMinNights',
      'monthlyLeakRatio',
    ],
  },
  {
    title: KIND_LABELS['runaway-zone'],
    intro: 'A zone using far more water or running far longer than it should, or water flowing with no zone on.',
    names: [
      'overVolumeRatio',
      'overVolumeMinExcessGal',
      'overVolumeHourTolerance',
      'overVolumeMinRuns',
      'longRunMadK',
      'longRunMinRatio',
      'longRunHistoryRuns',
      'longRunMinHistoryRuns',
      'longRunScheduleRatio',
      'openValveShareOfSmallestZone',
      'openValveDesignTolerance',
      'openValveMinHours',
    ],
  },
  {
    title: KIND_LABELS.overspend,
    intro: "The month's use so far, or its pace to month end, against the water budget.",
    names: ['overspendMinDays', 'monthToDateRatio', 'projectedRatio', 'projectionRecentDays'],
  },
  {
    title: KIND_LABELS['silent-meter'],
    intro: 'A meter that stops sending readings, or reads nothing while zones are watering.',
    names: ['silentHours', 'zeroFlowMinExpectedGal', 'zeroFlowMaxShare', 'zeroFlowMinDays'],
  },
  {
    title: 'Controller clock',
    intro: 'Lining up the controller’s run log with the meter when the controller’s clock is off.',
    names: ['controllerClockSearchMinutes'],
  },
  {
    title: 'How urgent an alert is',
    intro: 'Alerts are marked by how much water they waste against the site’s average daily budget.',
    names: ['severityActSoonShare', 'severityActNowShare'],
  },
];

export const THRESHOLD_TEXT: Record<ThresholdName, ThresholdText> = {
  controllerClockSearchMinutes: {
    label: 'Clock drift to allow for',
    help: 'Run times are shifted by up to this much to line them up with the meter. 0 turns this off.',
  },
  continuousFlowHours: {
    label: 'Non-stop flow before a leak is suspected',
    help: 'The meter must show water in every hour for this long.',
  },
  continuousFlowMinGph: {
    label: 'Smallest flow that counts as running',
    help: 'An hour counts as running when the meter moved more than this.',
  },
  nightStartHour: { label: 'Quiet night starts at', help: 'Used to find the lowest flow of each night.' },
  nightEndHour: { label: 'Quiet night ends before', help: 'The hour itself is not part of the night.' },
  nightMinQuietHours: {
    label: 'Quiet hours needed to judge a night',
    help: 'Night hours with no zone running; fewer and the night is skipped.',
  },
  nightBaselineNights: { label: 'Nights that set the usual night flow', help: 'The most recent normal nights.' },
  nightMinBaselineNights: {
    label: 'Nights on record before night flow is judged',
    help: 'A new site is not judged until it has this many normal nights.',
  },
  nightFlowMadK: {
    label: 'How far above the usual night flow is too high',
    help: 'Measured in the usual night-to-night spread: higher asks for a clearer rise.',
  },
  nightFlowMinExcessGph: {
    label: 'Smallest night-flow rise worth an alert',
    help: 'Smaller rises are ignored, however steady the nights were.',
  },
  nightFlowMinNights: { label: 'High nights in a row before an alert', help: 'One high night alone is not enough.' },
  monthlyLeakRatio: {
    label: 'Monthly reads: use that suggests a leak',
    help: 'For meters read once a month: a month at this many times its budget or more.',
  },
  overVolumeRatio: {
    label: 'Zone use that counts as far too much',
    help: 'A run using this many times the zone’s design flow over its minutes.',
  },
  overVolumeMinExcessGal: {
    label: 'Smallest extra water per run worth an alert',
    help: 'Meters round and flows vary; less than this is ignored.',
  },
  overVolumeHourTolerance: {
    label: 'Normal variation around a zone’s design flow',
    help: 'With one meter for the site, watering hours within this much of design count as normal.',
  },
  overVolumeMinRuns: { label: 'Heavy runs in a row before an alert', help: 'One heavy run alone is not enough.' },
  longRunMadK: {
    label: 'How much longer than usual is too long',
    help: 'Measured in the usual run-to-run spread of the zone.',
  },
  longRunMinRatio: {
    label: 'Shortest run that can count as too long',
    help: 'So that longer runs in hot weather are not flagged.',
  },
  longRunHistoryRuns: { label: 'Earlier runs that set a zone’s usual run', help: 'The most recent scheduled runs.' },
  longRunMinHistoryRuns: {
    label: 'Runs on record before long runs are judged',
    help: 'A new zone is not judged until it has this many runs.',
  },
  longRunScheduleRatio: {
    label: 'Longer than programmed',
    help: 'When the programmed minutes are known, a run this many times longer is flagged.',
  },
  openValveShareOfSmallestZone: {
    label: 'Flow with nothing running that suggests a stuck valve',
    help: 'Compared with the smallest zone’s design flow.',
  },
  openValveDesignTolerance: {
    label: 'How close to a zone’s design flow the extra water must be',
    help:
      'A valve is blamed only when the water starts as that zone’s run ends and flows within this much of ' +
      'its design flow; otherwise it is reported as a leak.',
  },
  openValveMinHours: { label: 'Hours of such flow before an alert', help: '' },
  overspendMinDays: {
    label: 'First day of the month the pace is judged',
    help: 'The first days of a month say too little.',
  },
  monthToDateRatio: {
    label: 'Use so far that counts as over budget',
    help: 'Compared with the budget for the days of the month so far.',
  },
  projectedRatio: {
    label: 'Month-end forecast that counts as heading over',
    help: 'At the recent pace, the month would end this far over its budget.',
  },
  projectionRecentDays: {
    label: 'Recent days behind the forecast',
    help: 'Two weeks evens out every-other-day and weekly schedules.',
  },
  silentHours: { label: 'Hours without readings before a meter is quiet', help: '' },
  zeroFlowMinExpectedGal: {
    label: 'Smallest planned watering to judge a still meter',
    help: 'Days when the zones should have used less are not judged.',
  },
  zeroFlowMaxShare: {
    label: 'Share of planned water that counts as “still”',
    help: 'The meter showed less than this share of what the runs should have used.',
  },
  zeroFlowMinDays: {
    label: 'Watering days in a row with a still meter',
    help: 'Then the meter may be broken or bypassed.',
  },
  severityActSoonShare: { label: 'Waste that makes an alert “Act soon”', help: '' },
  severityActNowShare: { label: 'Waste that makes an alert “Act now”', help: '' },
};

/** A threshold's unit as people read it, and the factor between the stored value and the shown one. */
export interface DisplayUnit {
  unit: string;
  factor: number;
}

const FIXED: Record<string, string> = {
  min: 'minutes',
  h: 'hours',
  'local hour': 'o’clock, site time (0–23)',
  nights: 'nights',
  runs: 'runs',
  days: 'days',
  '× spread': '× the usual spread',
  '× budget': '× the month’s budget',
  '× design': '× design use',
  '× usual': '× the usual run',
  '× schedule': '× the programmed minutes',
  '× smallest zone flow': '× the smallest zone’s flow',
  '× prorated budget': '× the budget so far',
  '× monthly budget': '× the month’s budget',
  '× daily budget': '× the average daily budget',
};

export function displayUnit(unit: string, metric: boolean): DisplayUnit {
  if (unit === 'share') return { unit: '%', factor: 100 };
  if (unit === 'gal') return metric ? { unit: 'L', factor: LITRES_PER_GALLON } : { unit: 'gal', factor: 1 };
  if (unit === 'gal/h')
    return metric ? { unit: 'L per hour', factor: LITRES_PER_GALLON } : { unit: 'gal per hour', factor: 1 };
  if (unit === 'gpm')
    return metric ? { unit: 'L per minute', factor: LITRES_PER_GALLON } : { unit: 'gal per minute', factor: 1 };
  return { unit: FIXED[unit] ?? unit, factor: 1 };
}

/** Shown values keep a few significant digits, so 0.05 gal/h becomes 0.189 L per hour, not 0.18927058920000001. */
export function shown(value: number, factor: number): number {
  return factor === 1 ? value : Number((value * factor).toPrecision(4));
}
