/** Times are shown in the site's own zone, named, so a portfolio across zones reads unambiguously. */
export function siteTime(iso: string, timeZone: string, withZone = true): string {
  const text = new Intl.DateTimeFormat('en-US', { timeZone, dateStyle: 'medium', timeStyle: 'short' }).format(
    new Date(iso),
  );
  if (!withZone) return text;
  const zone = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'short' })
    .formatToParts(new Date(iso))
    .find((p) => p.type === 'timeZoneName')?.value;
  return `${text} ${zone ?? timeZone}`;
}

export function gallons(value: number | null): string {
  return value === null ? 'not measurable' : `${Math.round(value).toLocaleString('en-US')} gal`;
}

export function money(value: { amount: number; currency: string } | null): string {
  return value === null
    ? 'no rate schedule'
    : `${value.amount.toLocaleString('en-US', { minimumFractionDigits: 2, maximumFractionDigits: 2 })} ` +
        `${value.currency}`;
}
