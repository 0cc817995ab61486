/** "3 h ago", "2 d ago": the age of the latest reading, short enough for a table cell. */
export function dataAge(iso: string | null, now: number): string {
  if (!iso) return 'no data';
  const minutes = Math.max(0, Math.round((now - Date.parse(iso)) / 60_000));
  if (minutes < 60) return `${minutes} min ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 48) return `${hours} h ago`;
  return `${Math.round(hours / 24).toLocaleString('en-US')} d ago`;
}
