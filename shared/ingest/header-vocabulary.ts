/**
 * What a messy header probably means: "Meter #", "Serial", "Read Date", "Usage (Gal)", "Consumption CCF",
 * "Interval Start", "Hr 01", "00:15", "Station", "Run Time (min)". Also units named in headers or unit cells.
 * Rules are tried in order; the first that matches wins, so the order encodes precedence
 * (e.g. "Read Date" is a date before it is a register read; "Meter Reading" is a reading before it is a meter).
 */
import { parseVolumeUnit, type VolumeUnit } from '../units/volume-units';

export type HeaderRole =
  | 'interval-slot'
  | 'unit'
  | 'readType'
  | 'multiplier'
  | 'registerDigits'
  | 'intervalMinutes'
  | 'controller'
  | 'station'
  | 'duration'
  | 'cause'
  | 'end'
  | 'start'
  | 'timestamp'
  | 'date'
  | 'time'
  | 'registerValue'
  | 'measuredGallons'
  | 'usageValue'
  | 'meter'
  | 'other';

export function normaliseHeader(header: string): string {
  return header
    .replace(/^\uFEFF/, '')
    .toLowerCase()
    .replace(/[_.]+/g, ' ')
    .replace(/\s+/g, ' ')
    .trim();
}

// "Hr 01", "HE 1", "H24", "Hour 3", "Int 96", a bare "7", "00:15", "24:00", "0:00-0:15".
const slotPatterns = [
  /^(?:hr|he|h|hour|int|interval|q|qh)\s*#?\s*\d{1,3}$/,
  /^\d{1,3}$/,
  /^\d{1,2}:\d{2}$/,
  /^\d{1,2}:\d{2}\s*[-–]\s*\d{1,2}:\d{2}$/,
];

const rules: Array<[HeaderRole, RegExp]> = [
  ['unit', /^(?:unit|units|uom|unit of measure|measure unit|volume unit)$/],
  [
    'readType',
    /\b(?:read|reading|usage) ?(?:type|code|status|source|quality)\b|^(?:actual ?\/ ?estimated|est|estimated|quality|data quality|read flag)$/,
  ],
  ['multiplier', /\b(?:multiplier|mult|meter constant|register factor|read factor|meter factor)\b/],
  ['registerDigits', /\b(?:dials|number of dials|register digits|digits|dial digits)\b/],
  [
    'intervalMinutes',
    /\binterval (?:length|len|minutes|mins?|duration)\b|\binterval \((?:min|mins|minutes)\)|^(?:resolution|int min|interval min)$/,
  ],
  ['controller', /\b(?:controller|ctrl|clock|timer) ?(?:id|#|no|name|serial)?\b/],
  ['station', /^(?!.*time ?zone)(?:.*\b(?:station|zone|valve|sta)\b.*)$/],
  [
    'duration',
    /\b(?:run ?time|runtime|duration|minutes run|mins run|watering (?:time|minutes))\b|^(?:minutes|mins|min)$/,
  ],
  ['cause', /\b(?:cause|reason|trigger|run type|event type|start type|origin)\b/],
  [
    'end',
    /\b(?:end|ended|stop|stopped|finish|finished|through|thru)\b|^to$|\b(?:service|period|bill|billing) to\b|\b(?:current|present) (?:read )?date\b/,
  ],
  ['start', /\b(?:start|started|begin|began|beginning|from)\b|\b(?:previous|prior|prev) (?:read )?date\b/],
  ['timestamp', /\b(?:timestamp|time stamp|date ?\/ ?time|datetime|date time|date and time|read at)\b/],
  ['date', /\b(?:date|day)\b/],
  ['time', /\b(?:time|hour|time of day)\b/],
  ['registerValue', /\b(?:register|cumulative|index|reading|read|dial|totali[sz]er)\b/],
  ['measuredGallons', /\b(?:measured|flow|actual|metered)\b/],
  [
    'usageValue',
    /\b(?:usage|consumption|volume|use|used|gallons|gal|gals|kgal|ccf|hcf|cf|m3|m³|quantity|qty|amount|value)\b/,
  ],
  ['meter', /\b(?:meter|serial|device|service point|sp id|meter ?#)\b|#$/],
];

/** A meter-like header that names the physical meter's serial rather than the account or service point. */
export function isSerialHeader(header: string): boolean {
  return /\bserial\b/.test(normaliseHeader(header));
}

/** The role a header most likely plays, ignoring which kind of file it is in. */
export function classifyHeader(header: string): HeaderRole {
  const h = normaliseHeader(header);
  if (h === '') return 'other';
  if (slotPatterns.some((p) => p.test(h))) return 'interval-slot';
  for (const [role, pattern] of rules) if (pattern.test(h)) return role;
  return 'other';
}

const unitRules: Array<[VolumeUnit, RegExp]> = [
  ['ccf', /\b(?:ccf|hcf|hundred cubic feet|100 ?cu ?ft|100 ?ft3)\b/],
  ['kgal', /\b(?:kgal|k ?gal|thousand gallons|1000 ?gal(?:lons)?|1,000 ?gal(?:lons)?)\b/],
  ['acre-ft', /\b(?:acre ?-?f(?:ee|oo)?t|acre ?ft|af)\b/],
  ['acre-in', /\b(?:acre ?-?inch(?:es)?|acre ?-?in)\b/],
  ['gal', /\b(?:gal|gals|gallons?|us gal)\b/],
  ['ft3', /\b(?:cf|cu ?ft|cu\.? ?ft|ft3|ft\^3|cubic f(?:ee|oo)t)\b|ft³/],
  ['m3', /\b(?:m3|cubic met(?:er|re)s?|cu ?m)\b|m³/],
  ['l', /\b(?:l|litres?|liters?)\b/],
];

/** A unit named in a header ("Usage (CCF)", "Consumption CCF") or a unit cell ("Gallons"), or null. */
export function unitFromText(text: string): VolumeUnit | null {
  try {
    return parseVolumeUnit(text); // exact spellings first (shared with the rest of the product)
  } catch {
    // fall through to searching inside a longer header
  }
  const h = normaliseHeader(text).replace(/[()[\]]/g, ' ');
  for (const [unit, pattern] of unitRules) if (pattern.test(h)) return unit;
  return null;
}
