/**
 * Invented hourly meter readings and controller runtime logs for the demo sites, as the CSV a utility or a
 * controller would export, so the seed brings them in through the real upload path. Deterministic: the same
 * text every run, which makes re-seeding a no-op (the same file is "already imported").
 */

const FIRST_DAY = Date.UTC(2026, 8, 1); // 2026-09-01
const DAYS = 91; // to 2026-11-30

export interface DemoFlow {
  meterRef: string;
  /** Gallons per hour while the site waters (its night window) and as background use. */
  wateringGph: number;
  baseGph: number;
  /** Local wall hours (0–23) of the watering window. */
  window: number[];
  /** A leak: continuous flow (gal/h) on every hour of these local dates, on top of normal use. */
  leak?: { from: string; to: string; gph: number };
  /** Extra flow (gal/h) at these local hours of one date: a valve stuck open, or a zone left running. */
  extra?: { date: string; hours: number[]; gph: number }[];
  /** The register stopped: zero on every hour of these local dates (a broken or bypassed meter). */
  broken?: { from: string; to: string };
}

/** A controller's program: stations run back to back from the window's first hour, covering the window. */
export interface DemoProgram {
  startHour: number;
  minutesPerStation: number;
  /** One night when one station ran far longer than its program (a runaway zone), matching a meter's `extra`. */
  longRun?: { date: string; station: string; minutes: number };
}

const pad = (n: number) => String(n).padStart(2, '0');
const dateOf = (day: number) => new Date(FIRST_DAY + day * 86_400_000).toISOString().slice(0, 10);

/** Seasonal factor: September waters the most, late November the least (invented, roughly ETo-shaped). */
const season = (day: number) => 1.15 - (0.7 * day) / DAYS;

/** One long-layout CSV (local wall times, gallons) for the given meters of one site. */
export function meterCsv(flows: DemoFlow[]): string {
  const lines = ['Meter #,Interval Start,Usage (Gal)'];
  for (const flow of flows) {
    for (let day = 0; day < DAYS; day++) {
      const date = dateOf(day);
      // Every third day is off; watering days run the night window.
      const waters = day % 3 !== 1;
      const leaking = flow.leak && date >= flow.leak.from && date <= flow.leak.to;
      for (let hour = 0; hour < 24; hour++) {
        // The fall-back day's repeated 01:00 hour appears twice, as a utility export has it.
        const repeats = date === '2026-11-01' && hour === 1 ? 2 : 1;
        for (let r = 0; r < repeats; r++) {
          let gallons = flow.baseGph * (0.6 + ((hour * 7 + day * 3) % 9) / 10);
          if (waters && flow.window.includes(hour))
            gallons += flow.wateringGph * season(day) * (0.9 + ((day + hour) % 5) / 20);
          if (leaking) gallons += flow.leak!.gph;
          for (const x of flow.extra ?? []) if (x.date === date && x.hours.includes(hour)) gallons += x.gph;
          if (flow.broken && date >= flow.broken.from && date <= flow.broken.to) gallons = 0;
          lines.push(`${flow.meterRef},${date} ${pad(hour)}:00,${gallons.toFixed(2)}`);
        }
      }
    }
  }
  return lines.join('\n') + '\n';
}

/** One runtime log (start + minutes + cause) for a controller's stations, matching the meters' watering nights. */
export function runtimeCsv(controllerRef: string, stations: string[], program: DemoProgram, gpm: number): string {
  const lines = ['Controller,Station,Start Time,Run Time (min),Cause,Flow (gal)'];
  for (let day = 0; day < DAYS; day++) {
    const date = dateOf(day);
    const waters = day % 3 !== 1;
    let minute = program.startHour * 60;
    stations.forEach((station) => {
      const start = `${date} ${pad(Math.floor(minute / 60) % 24)}:${pad(minute % 60)}`;
      if (!waters) {
        lines.push(`${controllerRef},${station},${start},0,${day % 2 ? 'Rain Skip' : 'Wind skip'},`);
        minute += 1;
        return;
      }
      const long = program.longRun && program.longRun.date === date && program.longRun.station === station;
      const runMinutes = long ? program.longRun!.minutes : program.minutesPerStation;
      // The controller's own flow sensor reads what the meter sees: design flow scaled like the meters' season.
      lines.push(
        `${controllerRef},${station},${start},${runMinutes},Scheduled,${(runMinutes * gpm * season(day)).toFixed(1)}`,
      );
      minute += runMinutes;
    });
  }
  return lines.join('\n') + '\n';
}
