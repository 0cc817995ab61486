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
          if (waters && flow.window.includes(hour)) gallons += flow.wateringGph * season(day) * (0.9 + ((day + hour) % 5) / 20);
          if (leaking) gallons += flow.leak!.gph;
          lines.push(`${flow.meterRef},${date} ${pad(hour)}:00,${gallons.toFixed(2)}`);
        }
      }
    }
  }
  return lines.join('\n') + '\n';
}

/** One runtime log (start + minutes + cause) for a controller's stations, matching the meters' watering nights. */
export function runtimeCsv(controllerRef: string, stations: string[], startHour: number, gpm: number): string {
  const lines = ['Controller,Station,Start Time,Run Time (min),Cause,Flow (gal)'];
  for (let day = 0; day < DAYS; day++) {
    const date = dateOf(day);
    const waters = day % 3 !== 1;
    let minute = startHour * 60;
    stations.forEach((station, i) => {
      const start = `${date} ${pad(Math.floor(minute / 60) % 24)}:${pad(minute % 60)}`;
      if (!waters) {
        lines.push(`${controllerRef},${station},${start},0,${day % 2 ? 'Rain Skip' : 'Wind skip'},`);
        minute += 1;
        return;
      }
      const runMinutes = Math.max(4, Math.round((12 + i * 3) * season(day)));
      lines.push(`${controllerRef},${station},${start},${runMinutes},Scheduled,${(runMinutes * gpm).toFixed(1)}`);
      minute += runMinutes;
    });
  }
  return lines.join('\n') + '\n';
}
