/**
 * Indoor allotment for a meter that serves buildings as well as landscape, so the landscape budget can be
 * compared with the meter's total: occupants × gallons per person per day × days.
 */
export function indoorAllotmentGallons(occupants: number, gallonsPerPersonPerDay: number, days: number): number {
  for (const [name, value] of [
    ['Occupants', occupants],
    ['Gallons per person per day', gallonsPerPersonPerDay],
    ['Days', days],
  ] as const) {
    if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be zero or more (got ${value})`);
  }
  return occupants * gallonsPerPersonPerDay * days;
}
