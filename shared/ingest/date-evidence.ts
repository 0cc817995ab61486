/** Collects what a table's date columns say about day/month order, before its rows are read for real. */
import { DateOrderEvidence } from './date-order';
import { parseTimestamp } from './timestamp-parsing';
import type { ColumnMapping } from './upload-kind';

/** The columns of a mapping that may hold dates. */
export function dateColumns(mapping: ColumnMapping): number[] {
  const c = mapping.columns;
  const columns = [c.timestamp, c.date, c.start, c.end].filter((i): i is number => i !== undefined);
  return [...new Set(columns)];
}

/** Evidence from every numeric date in `rows` (data rows; the first is file row `firstRow`). */
export function collectDateEvidence(mapping: ColumnMapping, rows: string[][], firstRow = 2): DateOrderEvidence {
  const evidence = new DateOrderEvidence();
  const columns = dateColumns(mapping);
  rows.forEach((cells, i) => {
    for (const column of columns) {
      const text = (cells[column] ?? '').trim();
      if (text === '') continue;
      const parsed = parseTimestamp(text);
      if ('numericDate' in parsed && parsed.numericDate) {
        evidence.observe(parsed.numericDate.first, parsed.numericDate.second, firstRow + i, text);
      }
    }
  });
  return evidence;
}
