import { addMonths } from '@shared/portfolio/period';

/** The twelve whole months before the current one, as the server's default. */
export function lastTwelveMonths(today = new Date()): { from: string; to: string } {
  const to = addMonths(today.toISOString().slice(0, 7), -1);
  return { from: addMonths(to, -11), to };
}
