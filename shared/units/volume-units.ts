/**
 * Volume units. US gallons are the base unit: every stored volume is gallons and other units are
 * derived from exact definitions, so converting there and back loses nothing but float rounding.
 */

/** Litres in one US gallon: 231 in³ exactly (NIST Handbook 44 App. C) with 1 in = 2.54 cm exactly. */
export const LITRES_PER_GALLON = 3.785411784;

/** Gallons in one cubic foot: 1728 in³ / 231 in³ ≈ 7.480519. */
export const GALLONS_PER_CUBIC_FOOT = 1728 / 231;

export const VOLUME_UNITS = ['gal', 'kgal', 'ccf', 'ft3', 'm3', 'l', 'acre-in', 'acre-ft'] as const;
export type VolumeUnit = (typeof VOLUME_UNITS)[number];

/** Gallons in one of each unit. CCF and HCF are the same unit (100 ft³); `hcf` is accepted as an alias. */
export const GALLONS_PER_UNIT: Readonly<Record<VolumeUnit, number>> = {
  gal: 1,
  kgal: 1000,
  ccf: 100 * GALLONS_PER_CUBIC_FOOT,
  ft3: GALLONS_PER_CUBIC_FOOT,
  m3: 1000 / LITRES_PER_GALLON,
  l: 1 / LITRES_PER_GALLON,
  // An acre is 43,560 ft², so an acre-inch is 43,560/12 ft³ and an acre-foot 43,560 ft³.
  'acre-in': (43_560 / 12) * GALLONS_PER_CUBIC_FOOT,
  'acre-ft': 43_560 * GALLONS_PER_CUBIC_FOOT,
};

/** Short labels used on screen and in reports. */
export const VOLUME_UNIT_LABELS: Readonly<Record<VolumeUnit, string>> = {
  gal: 'gal',
  kgal: 'kgal',
  ccf: 'CCF',
  ft3: 'ft³',
  m3: 'm³',
  l: 'L',
  'acre-in': 'acre-in',
  'acre-ft': 'acre-ft',
};

/** Accepts the unit ids above plus common spellings ("HCF", "gallons", "m^3"); throws on anything else. */
export function parseVolumeUnit(text: string): VolumeUnit {
  const key = text.trim().toLowerCase();
  const aliases: Record<string, VolumeUnit> = {
    gal: 'gal',
    gallon: 'gal',
    gallons: 'gal',
    kgal: 'kgal',
    'thousand gallons': 'kgal',
    ccf: 'ccf',
    hcf: 'ccf',
    ft3: 'ft3',
    'ft³': 'ft3',
    cf: 'ft3',
    'cubic feet': 'ft3',
    'cubic foot': 'ft3',
    m3: 'm3',
    'm³': 'm3',
    'm^3': 'm3',
    'cubic metre': 'm3',
    'cubic meter': 'm3',
    l: 'l',
    litre: 'l',
    liter: 'l',
    litres: 'l',
    liters: 'l',
    'acre-in': 'acre-in',
    'acre-inch': 'acre-in',
    'acre-ft': 'acre-ft',
    'acre-foot': 'acre-ft',
    af: 'acre-ft',
  };
  const unit = aliases[key];
  if (!unit) throw new RangeError(`Unknown volume unit "${text}"`);
  return unit;
}

export function toGallons(value: number, unit: VolumeUnit): number {
  return value * GALLONS_PER_UNIT[unit];
}

export function fromGallons(gallons: number, unit: VolumeUnit): number {
  return gallons / GALLONS_PER_UNIT[unit];
}

export function convertVolume(value: number, from: VolumeUnit, to: VolumeUnit): number {
  if (from === to) return value;
  return fromGallons(toGallons(value, from), to);
}
