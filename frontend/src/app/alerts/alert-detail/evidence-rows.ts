/** Readable names and units for the numbers detectors attach to a finding; unknown names are shown as given. */
const KNOWN: Record<string, { label: string; unit: string }> = {
  hoursFlowing: { label: 'Hours of flow without a break', unit: 'h' },
  lowestHourGal: { label: 'Lowest hour in that time', unit: 'gal' },
  totalGal: { label: 'Metered in that time', unit: 'gal' },
  runsOutsideRules: { label: 'Runs outside the watering rules', unit: '' },
  manualRunsOutsideRules: { label: 'Manual runs outside the rules (shown apart)', unit: '' },
  minutesOutsideRules: { label: 'Minutes of those runs', unit: 'min' },
  notAWateringDay: { label: 'On a day the rule does not allow', unit: '' },
  outsideAllowedHours: { label: 'Outside the allowed hours', unit: '' },
  overStationLimit: { label: 'Longer than the station limit', unit: '' },
  fromMeterOnly: { label: 'Judged from meter hours (no controller log)', unit: '' },
};

function split(name: string): { label: string; unit: string } {
  if (KNOWN[name]) return KNOWN[name];
  // Detector names end in their unit (…Gal, …Gph, …Minutes, …Ratio); the rest of the name reads as words.
  const units: [RegExp, string][] = [
    [/Gal$/, 'gal'],
    [/Gph$/, 'gal/h'],
    [/Gpm$/, 'gpm'],
    [/Minutes$/, 'min'],
    [/Hours$/, 'h'],
    [/Days$/, 'days'],
    [/Ratio$/, '×'],
    [/Share$/, 'share'],
  ];
  const found = units.find(([re]) => re.test(name));
  const words = name
    .replace(found?.[0] ?? /$^/, '')
    .replace(/([A-Z])/g, ' $1')
    .toLowerCase()
    .trim();
  return { label: words.charAt(0).toUpperCase() + words.slice(1), unit: found?.[1] ?? '' };
}

export function evidenceRows(numbers: Record<string, number>): { label: string; value: string }[] {
  return Object.entries(numbers).map(([name, value]) => {
    const { label, unit } = split(name);
    return { label, value: `${value.toLocaleString('en-US', { maximumFractionDigits: 2 })}${unit ? ` ${unit}` : ''}` };
  });
}
