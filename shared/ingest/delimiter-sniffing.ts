/** Guess a CSV delimiter and tidy the start of a text sample, before any parser sees it. */

export const DELIMITERS = [',', ';', '\t'] as const;
export type Delimiter = (typeof DELIMITERS)[number];

const BOM = '\uFEFF';

/** Removes a leading UTF-8 byte-order mark, which spreadsheet exports add and which would corrupt the first header. */
export function stripBom(text: string): string {
  return text.startsWith(BOM) ? text.slice(BOM.length) : text;
}

/** Counts `delimiter` outside double-quoted fields on one line. */
function countOutsideQuotes(line: string, delimiter: string): number {
  let count = 0;
  let quoted = false;
  for (const ch of line) {
    if (ch === '"') quoted = !quoted;
    else if (ch === delimiter && !quoted) count++;
  }
  return count;
}

/**
 * Picks the delimiter whose count is the same on every sampled line (the header included) and highest.
 * Consistency beats frequency because `;` files with decimal commas have many commas in data rows but none in
 * the header. Falls back to `,` (a one-column file has no delimiter at all).
 */
export function sniffDelimiter(sample: string, maxLines = 20): Delimiter {
  const lines = stripBom(sample)
    .split(/\r\n|\n|\r/)
    .filter((line) => line.trim() !== '')
    .slice(0, maxLines);
  // The last line of a sample cut mid-file may be partial, so judge it only when it is the only one.
  const judged = lines.length > 2 ? lines.slice(0, -1) : lines;
  let best: { delimiter: Delimiter; count: number; consistent: boolean } | null = null;
  for (const delimiter of DELIMITERS) {
    const counts = judged.map((line) => countOutsideQuotes(line, delimiter));
    const first = counts[0] ?? 0;
    if (first === 0) continue;
    const consistent = counts.every((c) => c === first);
    const better = !best || (consistent && !best.consistent) || (consistent === best.consistent && first > best.count);
    if (better) best = { delimiter, count: first, consistent };
  }
  return best?.delimiter ?? ',';
}
