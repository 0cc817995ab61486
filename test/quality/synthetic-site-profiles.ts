/**
 * Invented sites for the detection-quality test: names, places and zone lists are made up. Zone flows are
 * commercial-landscape sized (spray zones 9–16 gpm, drip zones of a few hundred emitters 5–8 gpm); minutes are
 * the run at a reference ETo of 5 mm/day, which the generator scales by the day's ETo as a smart controller would.
 */

export interface SyntheticZone {
  zoneId: string;
  designGpm: number;
  minutesAtReferenceEto: number;
}

export interface SiteProfile {
  name: string;
  timeZone: string;
  hemisphere: 'north' | 'south';
  /** Mean and half-range of daily ETo over the year, mm/day. */
  etoMeanMm: number;
  etoSwingMm: number;
  irrigationWindow: { startHour: number; endHour: number };
  /** Local hour the nightly program starts. */
  cycleStartHour: number;
  /** Waters every day (1) or every other day (2). */
  wateringEveryDays: 1 | 2;
  /** The controller reports measured gallons per run (a flow sensor). */
  flowSensor: boolean;
  /** Budget ÷ normal use; budgets leave some headroom. */
  budgetHeadroom: number;
  zones: SyntheticZone[];
}

const spray = (id: string, gpm: number, minutes: number): SyntheticZone => ({
  zoneId: id,
  designGpm: gpm,
  minutesAtReferenceEto: minutes,
});
const drip = spray;

export const SITE_PROFILES: readonly SiteProfile[] = [
  {
    name: 'Larkspur Commons HOA',
    timeZone: 'America/Los_Angeles',
    hemisphere: 'north',
    etoMeanMm: 3.6,
    etoSwingMm: 2.0,
    irrigationWindow: { startHour: 21, endHour: 6 },
    cycleStartHour: 21,
    wateringEveryDays: 1,
    flowSensor: false,
    budgetHeadroom: 1.2,
    zones: [
      spray('L1', 12, 14),
      spray('L2', 14, 12),
      spray('L3', 10, 16),
      spray('L4', 13, 12),
      drip('L5', 6, 45),
      drip('L6', 5.5, 40),
    ],
  },
  {
    name: 'Quarry Bend Office Park',
    timeZone: 'America/Denver',
    hemisphere: 'north',
    etoMeanMm: 3.8,
    etoSwingMm: 2.4,
    irrigationWindow: { startHour: 21, endHour: 6 },
    cycleStartHour: 22,
    wateringEveryDays: 2,
    flowSensor: true,
    budgetHeadroom: 1.25,
    zones: [spray('Q1', 15, 20), spray('Q2', 16, 18), spray('Q3', 11, 22), drip('Q4', 7, 60), drip('Q5', 8, 50)],
  },
  {
    name: 'Saguaro Flats School',
    timeZone: 'America/Phoenix',
    hemisphere: 'north',
    etoMeanMm: 5.5,
    etoSwingMm: 2.8,
    irrigationWindow: { startHour: 20, endHour: 5 },
    cycleStartHour: 20,
    wateringEveryDays: 1,
    flowSensor: false,
    budgetHeadroom: 1.15,
    zones: [
      spray('S1', 14, 10),
      spray('S2', 12, 11),
      spray('S3', 15, 9),
      spray('S4', 9, 12),
      drip('S5', 6.5, 35),
      drip('S6', 5, 30),
      drip('S7', 7.5, 25),
    ],
  },
  {
    name: 'Hollis Green Streetscape',
    timeZone: 'America/New_York',
    hemisphere: 'north',
    etoMeanMm: 3.0,
    etoSwingMm: 2.0,
    irrigationWindow: { startHour: 22, endHour: 6 },
    cycleStartHour: 23,
    wateringEveryDays: 2,
    flowSensor: false,
    budgetHeadroom: 1.2,
    zones: [drip('H1', 6, 50), drip('H2', 5, 55), spray('H3', 11, 18), drip('H4', 7, 40)],
  },
  {
    name: 'Wattle Reach Park',
    timeZone: 'Australia/Sydney',
    hemisphere: 'south',
    etoMeanMm: 3.8,
    etoSwingMm: 2.0,
    irrigationWindow: { startHour: 21, endHour: 6 },
    cycleStartHour: 21,
    wateringEveryDays: 1,
    flowSensor: true,
    budgetHeadroom: 1.2,
    zones: [spray('W1', 16, 15), spray('W2', 14, 15), spray('W3', 12, 18), drip('W4', 6, 40), spray('W5', 13, 14)],
  },
];
