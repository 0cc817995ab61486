/**
 * Seeded generator of months of hourly meter data and controller runtime logs for invented sites, with known
 * injected events. The ground truth is kept as labelled events (detector kind and period), plus the kinds an
 * event may also rightly trigger (`alsoExplains`): a valve stuck open is also continuous flow, a big leak also
 * overspends. Those side-findings are counted apart, neither as hits nor as false alarms.
 */
import { resolveLocalTime } from '../../shared/ingest/zoned-time';
import { localHourOf, localMidnightUtc, HOUR_MS, DAY_MS } from '../../shared/watch/site-clock';
import { budgetFactsOf } from '../../shared/watch/budget-facts';
import type { FindingKind } from '../../shared/watch/finding';
import type { MeterHour, MonthlyUse, SiteWatchInput, ZoneRun } from '../../shared/watch/watch-inputs';
import { addDays, dayOfYearFromIso } from '../../shared/weather/day-of-year';
import { seededRandom, type Random } from './seeded-random';
import type { SiteProfile, SyntheticZone } from './synthetic-site-profiles';

export type InjectedEvent =
  | {
      kind: 'small-leak' | 'large-leak';
      startDay: number;
      days: number;
      gpm: number;
      /** Local start time (default 13:00): a leak that starts inside the watering window must not look like a valve. */
      startAt?: { hour: number; minute: number };
    }
  | { kind: 'stuck-valve'; startDay: number; days: number; zoneIndex: number; shareOfDesign: number }
  | { kind: 'long-run'; startDay: number; nights: number; zoneIndex: number; factor: number }
  | { kind: 'broken-lateral'; startDay: number; nights: number; zoneIndex: number; factor: number }
  | { kind: 'broken-meter'; startDay: number; days: number }
  | { kind: 'silent-meter'; startDay: number; days: number }
  | { kind: 'overspend-month'; monthIndexes: number[]; how: 'seasonal-adjust' | 'extra-start'; factor: number }
  | { kind: 'rainy-week'; startDay: number; days: number };

export interface Scenario {
  id: string;
  profile: SiteProfile;
  seed: number;
  /** Local date of the first day. */
  startDate: string;
  days: number;
  event: InjectedEvent | null;
  /** Keep only monthly totals, as for a site whose meter is read once a month. */
  monthlyReadsOnly?: boolean;
  /** Local dates with no weather at all (no normals either): the budget leaves them out. */
  missingWeatherDates?: string[];
  /** Two zones (indexes) that water in alternating cycles (cycle and soak), sharing the same meter hours. */
  cycleSoak?: [number, number];
}

export interface GroundTruthEvent {
  label: string;
  /** The detector that must find it, or 'none' for a period that must stay quiet. */
  kind: FindingKind | 'none';
  startUtc: number;
  endUtc: number;
  alsoExplains: FindingKind[];
  /** The zone at fault, for events that have one. */
  zoneId?: string;
  /** The water the event really wasted inside the data, where the generator knows it exactly. */
  excessGal?: number;
}

export interface SyntheticSite {
  input: SiteWatchInput;
  truth: GroundTruthEvent[];
  /** How many minutes the controller's log stamps are ahead of the meter's clock. */
  controllerClockAheadMinutes: number;
  /** Local midnights of the data's days and the one after the last: the site-days the per-day score counts. */
  dayBoundsUtc: number[];
}

interface Flow {
  fromUtc: number;
  toUtc: number;
  gpm: number;
}

/** Seasonal ETo on a smooth curve peaking mid-summer; budgets use it as the "normal year". */
function normalEtoMm(profile: SiteProfile, date: string): number {
  const peakDay = profile.hemisphere === 'north' ? 196 : 15;
  return profile.etoMeanMm + profile.etoSwingMm * Math.cos((2 * Math.PI * (dayOfYearFromIso(date) - peakDay)) / 365);
}

function dailyNormalUse(profile: SiteProfile, date: string): number {
  const perDay =
    profile.zones.reduce((s, z) => s + z.designGpm * z.minutesAtReferenceEto, 0) / profile.wateringEveryDays;
  return (perDay * normalEtoMm(profile, date)) / 5;
}

function localInstant(date: string, hour: number, minute: number, zone: string): number {
  const [year, month, day] = date.split('-').map(Number) as [number, number, number];
  const r = resolveLocalTime({ year, month, day, hour, minute, second: 0 }, zone);
  if (r.kind === 'unique') return r.utcMs;
  if (r.kind === 'ambiguous') return r.earlierUtcMs;
  // Controllers skip to the next existing minute when a start time falls in the spring-forward gap.
  return localInstant(date, hour + 1, 0, zone);
}

function monthsSpanned(startDate: string, days: number): string[] {
  const months = new Set<string>();
  for (let d = 0; d < days; d++) months.add(addDays(startDate, d).slice(0, 7));
  return [...months];
}

function monthDates(month: string): string[] {
  const [y, m] = month.split('-').map(Number) as [number, number];
  const n = new Date(Date.UTC(y, m, 0)).getUTCDate();
  return Array.from({ length: n }, (_, i) => `${month}-${String(i + 1).padStart(2, '0')}`);
}

interface NightContext {
  rng: Random;
  /** Each zone's true flow ÷ the design flow on record: as-built records are rarely exact. */
  recordError: number[];
  /** The controller's clock against the meter's, ms: controller logs are stamped a few minutes off. */
  clockSkewMs: number;
  profile: SiteProfile;
  event: InjectedEvent | null;
  runs: ZoneRun[];
  flows: Flow[];
  truthRuns: Array<{ startUtc: number; endUtc: number }>;
  stuck: { fromUtc: number; toUtc: number; gpm: number } | null;
  cycleSoak: [number, number] | undefined;
}

/** One night's program: zones one after another from the start hour, minutes scaled by the day's ETo. */
const CYCLES = 3;

/** The night's runs in order: one per zone, or for a cycle-and-soak pair their cycles alternating. */
function programOrder(
  profile: SiteProfile,
  cycleSoak: [number, number] | undefined,
): Array<{ zi: number; share: number }> {
  const order: Array<{ zi: number; share: number }> = [];
  profile.zones.forEach((_, zi) => {
    if (!cycleSoak || !cycleSoak.includes(zi)) order.push({ zi, share: 1 });
    else if (zi === cycleSoak[0])
      for (let c = 0; c < CYCLES; c++) order.push({ zi, share: 1 / CYCLES }, { zi: cycleSoak[1], share: 1 / CYCLES });
  });
  return order;
}

/** One night's program: zones one after another from the start hour, minutes scaled by the day's ETo. */
function waterNight(
  ctx: NightContext,
  dayIndex: number,
  etoMm: number,
  startUtc: number,
  runtimeFactor: number,
): number {
  const { rng, profile, event } = ctx;
  let t = startUtc;
  for (const { zi, share } of programOrder(profile, ctx.cycleSoak)) {
    const zone = profile.zones[zi]!;
    let minutes = Math.max(1, Math.round((zone.minutesAtReferenceEto * etoMm * runtimeFactor * share) / 5));
    let flowFactor = 1;
    const hit = (e: { startDay: number; nights: number; zoneIndex: number }) =>
      zi === e.zoneIndex && dayIndex >= e.startDay && dayIndex < e.startDay + e.nights;
    if (event?.kind === 'long-run' && hit(event)) minutes = Math.round(minutes * event.factor);
    if (event?.kind === 'broken-lateral' && hit(event)) flowFactor = event.factor;
    const gpm = zone.designGpm * ctx.recordError[zi]! * (1 + rng.normal(0, 0.04)) * flowFactor;
    const end = t + minutes * 60_000;
    ctx.runs.push({
      zoneId: zone.zoneId,
      startUtc: t + ctx.clockSkewMs,
      minutes,
      cause: 'scheduled',
      ...(profile.flowSensor ? { measuredGallons: Math.round(gpm * minutes * (1 + rng.normal(0, 0.02))) } : {}),
    });
    ctx.flows.push({ fromUtc: t, toUtc: end, gpm });
    if ((event?.kind === 'long-run' || event?.kind === 'broken-lateral') && hit(event))
      ctx.truthRuns.push({ startUtc: t, endUtc: end });
    if (event?.kind === 'stuck-valve' && zi === event.zoneIndex && dayIndex >= event.startDay && !ctx.stuck) {
      ctx.stuck = { fromUtc: end, toUtc: end + event.days * DAY_MS, gpm: zone.designGpm * event.shareOfDesign };
      ctx.flows.push({ fromUtc: end, toUtc: ctx.stuck.toUtc, gpm: ctx.stuck.gpm });
    }
    t = end;
  }
  return t;
}

/** Hourly register differences: the register counts whole gallons, so hourly values are whole and carry over. */
function meterHoursFrom(flows: Flow[], fromUtc: number, toUtc: number): number[] {
  const n = Math.round((toUtc - fromUtc) / HOUR_MS);
  const exact = new Array<number>(n).fill(0);
  for (const f of flows) {
    for (let h = Math.max(0, Math.floor((f.fromUtc - fromUtc) / HOUR_MS)); h < n; h++) {
      const hs = fromUtc + h * HOUR_MS;
      if (hs >= f.toUtc) break;
      const minutes = (Math.min(f.toUtc, hs + HOUR_MS) - Math.max(f.fromUtc, hs)) / 60_000;
      if (minutes > 0) exact[h]! += minutes * f.gpm;
    }
  }
  let register = 0;
  let shown = 0;
  return exact.map((v) => {
    register += v;
    const next = Math.floor(register);
    const diff = next - shown;
    shown = next;
    return diff;
  });
}

export function generateSite(scenario: Scenario): SyntheticSite {
  const { profile, event } = scenario;
  const rng = seededRandom(scenario.seed);
  const zone = profile.timeZone;
  const fromUtc = localMidnightUtc(scenario.startDate, zone);
  const toUtc = localMidnightUtc(addDays(scenario.startDate, scenario.days), zone);
  const recordError = profile.zones.map(() => rng.uniform(0.85, 1.15));
  const clockSkewMs = Math.round(rng.uniform(-5, 5)) * 60_000;
  const ctx: NightContext = {
    rng,
    profile,
    recordError,
    clockSkewMs,
    runs: [],
    flows: [],
    truthRuns: [],
    stuck: null,
    event,
    cycleSoak: scenario.cycleSoak,
  };
  const truth: GroundTruthEvent[] = [];
  const months = monthsSpanned(scenario.startDate, scenario.days);
  const dayStart = (d: number) => localMidnightUtc(addDays(scenario.startDate, d), zone);

  for (let d = 0; d < scenario.days; d++) {
    const date = addDays(scenario.startDate, d);
    const raining = event?.kind === 'rainy-week' && d >= event.startDay && d < event.startDay + event.days;
    const etoMm =
      normalEtoMm(profile, date) * Math.min(1.4, Math.max(0.6, 1 + rng.normal(0, 0.1))) * (raining ? 0.3 : 1);
    const inOverspend =
      event?.kind === 'overspend-month' && event.monthIndexes.some((i) => date.slice(0, 7) === months[i]);
    const factor = inOverspend && event.how === 'seasonal-adjust' ? event.factor : 1;
    if (d % profile.wateringEveryDays === 0) {
      const start = localInstant(date, profile.cycleStartHour, 0, zone);
      if (raining) {
        // The controller logs what it would have run, marked as a rain skip; the meter stays still.
        let t = start;
        for (const z of profile.zones) {
          const minutes = Math.max(1, Math.round((z.minutesAtReferenceEto * normalEtoMm(profile, date)) / 5));
          ctx.runs.push({ zoneId: z.zoneId, startUtc: t + ctx.clockSkewMs, minutes, cause: 'skipped-rain' });
          t += minutes * 60_000;
        }
      } else {
        const end = waterNight(ctx, d, etoMm, start, factor);
        if (inOverspend && event.how === 'extra-start') waterNight(ctx, d, etoMm, end + HOUR_MS, 1);
      }
    }
    // Everyday noise that must not raise flags: a crew testing a zone by hand, a quick-coupler used for an hour.
    if (rng.chance(0.03)) {
      const z: SyntheticZone = rng.pick(profile.zones);
      const startUtc = localInstant(date, 14, rng.int(0, 30), zone);
      const minutes = rng.int(4, 10);
      ctx.runs.push({ zoneId: z.zoneId, startUtc: startUtc + ctx.clockSkewMs, minutes, cause: 'manual' });
      ctx.flows.push({ fromUtc: startUtc, toUtc: startUtc + minutes * 60_000, gpm: z.designGpm });
    }
    if (rng.chance(0.03)) {
      const s = localInstant(date, 10, 0, zone);
      ctx.flows.push({ fromUtc: s, toUtc: s + rng.int(30, 90) * 60_000, gpm: rng.uniform(0.5, 1.2) });
    }
  }

  if (event?.kind === 'small-leak' || event?.kind === 'large-leak') {
    const at = event.startAt ?? { hour: 13, minute: 0 };
    const s = localInstant(addDays(scenario.startDate, event.startDay), at.hour, at.minute, zone);
    const e = s + event.days * DAY_MS;
    ctx.flows.push({ fromUtc: s, toUtc: e, gpm: event.gpm });
    truth.push({
      label: `${event.kind} ${event.gpm.toFixed(2)} gpm`,
      kind: 'leak',
      startUtc: s,
      endUtc: e,
      alsoExplains: ['overspend'],
    });
  }

  let hourly = meterHoursFrom(ctx.flows, fromUtc, toUtc).map((gallons, i): MeterHour | null => ({
    startUtc: fromUtc + i * HOUR_MS,
    gallons,
  }));
  // Occasional lost hours, as any logger has.
  hourly = hourly.map((h) => (h && rng.chance(0.002) ? null : h));

  switch (event?.kind) {
    case 'stuck-valve':
      if (ctx.stuck)
        truth.push({
          label: `valve ${profile.zones[event.zoneIndex]!.zoneId} stuck open`,
          kind: 'runaway-zone',
          zoneId: profile.zones[event.zoneIndex]!.zoneId,
          startUtc: ctx.stuck.fromUtc,
          endUtc: ctx.stuck.toUtc,
          alsoExplains: ['leak', 'overspend'],
          excessGal: (ctx.stuck.gpm * (Math.min(toUtc, ctx.stuck.toUtc) - ctx.stuck.fromUtc)) / 60_000,
        });
      break;
    case 'long-run':
    case 'broken-lateral':
      if (ctx.truthRuns.length > 0) {
        truth.push({
          label: `${event.kind} zone ${profile.zones[event.zoneIndex]!.zoneId} ×${event.factor.toFixed(1)}`,
          zoneId: profile.zones[event.zoneIndex]!.zoneId,
          kind: 'runaway-zone',
          startUtc: ctx.truthRuns[0]!.startUtc,
          endUtc: ctx.truthRuns[ctx.truthRuns.length - 1]!.endUtc,
          alsoExplains: ['overspend'],
        });
      }
      break;
    case 'broken-meter':
    case 'silent-meter': {
      const s = dayStart(event.startDay) + 9 * HOUR_MS;
      const e = Math.min(toUtc, s + event.days * DAY_MS);
      hourly = hourly.map((h) =>
        h && h.startUtc >= s && h.startUtc < e ? (event.kind === 'silent-meter' ? null : { ...h, gallons: 0 }) : h,
      );
      truth.push({
        label: `${event.kind} ${((e - s) / DAY_MS).toFixed(1)} d${e === toUtc ? ' (to the end)' : ''}`,
        kind: 'silent-meter',
        startUtc: s,
        endUtc: e,
        alsoExplains: [],
      });
      break;
    }
    case 'overspend-month':
      for (const index of event.monthIndexes) {
        const month = months[index]!;
        const s = localMidnightUtc(`${month}-01`, zone);
        const e = Math.min(toUtc, localMidnightUtc(addDays(monthDates(month).pop()!, 1), zone));
        truth.push({
          label: `overspend ${month} ${event.how} ×${event.factor.toFixed(2)}`,
          kind: 'overspend',
          startUtc: s,
          endUtc: e,
          alsoExplains: [],
        });
      }
      break;
    case 'rainy-week':
      truth.push({
        label: `rainy week, ${event.days} d skipped`,
        kind: 'none',
        startUtc: dayStart(event.startDay),
        endUtc: dayStart(event.startDay + event.days),
        alsoExplains: [],
      });
      break;
    default:
      break;
  }

  const meterHours = hourly.filter((h): h is MeterHour => h !== null);
  // The budget as the job builds it: day by day, a day without weather left out of its month.
  const missing = new Set(scenario.missingWeatherDates ?? []);
  const { monthlyBudgets: budgetMonths, dailyBudgets } = budgetFactsOf(
    months.flatMap((m) =>
      monthDates(m).map((date) => ({
        date,
        gallons: missing.has(date) ? null : dailyNormalUse(profile, date) * profile.budgetHeadroom,
        estimated: false,
      })),
    ),
  );
  const input: SiteWatchInput = {
    site: {
      siteId: scenario.id,
      timeZone: zone,
      irrigationWindow: profile.irrigationWindow,
      monthlyBudgets: budgetMonths,
      dailyBudgets,
      rateSchedule: {
        name: 'Invented reclaimed tiers',
        unit: 'ccf',
        currency: 'USD',
        fixedChargePerPeriod: 40,
        volumeCharge: {
          kind: 'tiered',
          tiers: [
            { upToUnits: 100, pricePerUnit: 2.1 },
            { upToUnits: null, pricePerUnit: 3.4 },
          ],
        },
      },
    },
    zones: profile.zones.map((z) => ({ zoneId: z.zoneId, designGpm: z.designGpm })),
    runs: ctx.runs.sort((a, b) => a.startUtc - b.startUtc),
    asOfUtc: toUtc,
  };
  if (scenario.monthlyReadsOnly) {
    const totals = new Map<string, number>();
    for (const h of meterHours) {
      const m = localHourOf(h.startUtc, zone).month;
      totals.set(m, (totals.get(m) ?? 0) + h.gallons);
    }
    // Only whole months inside the data: a part month would look like a small month, not a read.
    const whole = months.filter(
      (m) =>
        localMidnightUtc(`${m}-01`, zone) >= fromUtc &&
        localMidnightUtc(addDays(monthDates(m).pop()!, 1), zone) <= toUtc,
    );
    input.monthlyUse = whole.map((month): MonthlyUse => ({ month, gallons: totals.get(month) ?? 0 }));
  } else {
    input.meterHours = meterHours;
  }
  const dayBoundsUtc = Array.from({ length: scenario.days + 1 }, (_, d) => dayStart(d));
  return { input, truth, controllerClockAheadMinutes: clockSkewMs / 60_000, dayBoundsUtc };
}
