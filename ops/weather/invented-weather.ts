import { addDays, dayOfYearFromIso } from '@shared/weather/day-of-year';
import { degreesToRadians, extraterrestrialRadiationDailyMj } from '@shared/weather/solar-geometry';

/**
 * Invented daily weather for any point: a smooth seasonal cycle (warm, dry summers; cool, wetter winters)
 * plus deterministic day-to-day noise seeded by the point and the date, so the same request always gets the
 * same answer. It imitates no real network; the figures are plausible, not measured.
 */

export interface InventedDay {
  date: string;
  tempHighC: number;
  tempLowC: number;
  humidityHighPct: number;
  humidityLowPct: number;
  wind2mMs: number;
  solarMj: number;
  rainMm: number;
}

/** FNV-1a, then mulberry32: a tiny seeded generator (no crypto needed, only repeatability). */
function seededRandom(key: string): () => number {
  let h = 0x811c9dc5;
  for (let i = 0; i < key.length; i++) h = Math.imul(h ^ key.charCodeAt(i), 0x01000193);
  let a = h >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const round = (value: number, digits: number) => Math.round(value * 10 ** digits) / 10 ** digits;

/** True on the few days the invented feed "loses", so gaps and their filling can be seen and tested. */
export function inventedDayMissing(latitude: number, longitude: number, date: string): boolean {
  return seededRandom(`gap|${latitude.toFixed(3)}|${longitude.toFixed(3)}|${date}`)() < 0.012;
}

export function inventedDay(latitude: number, longitude: number, date: string): InventedDay {
  const random = seededRandom(`${latitude.toFixed(3)}|${longitude.toFixed(3)}|${date}`);
  const j = dayOfYearFromIso(date);
  // +1 at the height of summer, −1 in midwinter (seasons flip south of the equator).
  const season = Math.cos((2 * Math.PI * (j - 200)) / 365.25) * (latitude >= 0 ? 1 : -1);
  const absLat = Math.abs(latitude);
  // Points further east of the (invented) coast get hotter summers: a crude continentality term.
  const inland = Math.min(1, Math.max(0, (longitude + 122) / 12));
  const meanC = 30 - 0.42 * absLat + 2 * inland + (9 + 3 * inland) * season + (random() - 0.5) * 4;
  const rangeC = 11 + 5 * Math.max(0, season) + 4 * inland + (random() - 0.5) * 3;
  // Inland points are drier: fewer wet days in every season.
  const wetChance = (season < 0 ? 0.06 + 0.28 * -season : 0.03) * (1 - 0.6 * inland);
  const raining = random() < wetChance;
  const rainMm = raining ? round(0.5 - Math.log(1 - random() * 0.98) * 7, 1) : 0;
  const ra = extraterrestrialRadiationDailyMj(degreesToRadians(latitude), j);
  const sunshineFraction = raining ? 0.15 + random() * 0.3 : 0.7 + 0.25 * random();
  return {
    date,
    tempHighC: round(meanC + rangeC / 2 - (raining ? 3 : 0), 1),
    tempLowC: round(meanC - rangeC / 2, 1),
    humidityHighPct: round(Math.min(100, raining ? 98 : 78 + 12 * -Math.min(0, season) + random() * 8), 0),
    humidityLowPct: round(Math.max(8, (raining ? 60 : 32) - 14 * season - 8 * inland + (random() - 0.5) * 10), 0),
    wind2mMs: round(Math.max(0.6, 1.7 + 0.7 * season + (random() - 0.3) * 1.4), 1),
    solarMj: round(ra * (0.25 + 0.5 * sunshineFraction), 1),
    rainMm,
  };
}

/** Every day from `from` to `to` inclusive, leaving out the invented feed's missing days when asked. */
export function inventedDays(
  latitude: number,
  longitude: number,
  from: string,
  to: string,
  options: { withGaps: boolean },
): InventedDay[] {
  const days: InventedDay[] = [];
  for (let date = from; date <= to; date = addDays(date, 1)) {
    if (options.withGaps && inventedDayMissing(latitude, longitude, date)) continue;
    days.push(inventedDay(latitude, longitude, date));
  }
  return days;
}
