/** Numbers as spreadsheets and meter exports write them, with a reason when a cell is not one. */

export type ParsedNumber = { ok: true; value: number } | { ok: false; message: string };

export interface NumberFormat {
  /** `1.234,5` instead of `1,234.5`. Only a mapping for a `;`-delimited file should set this. */
  decimalComma?: boolean;
}

// Grouped thousands must come in threes ("1,234,567"), so "1,23" is rejected rather than read as 123.
const pointStyle = /^[+-]?(?:\d{1,3}(?:,\d{3})+|\d+)(?:\.\d+)?$|^[+-]?\.\d+$/;
const commaStyle = /^[+-]?(?:\d{1,3}(?:\.\d{3})+|\d+)(?:,\d+)?$|^[+-]?,\d+$/;

/** `123` or `123.45`: digits with at most one point between digits, the form nearly every cell has (no regex). */
function isPlainDecimal(t: string): boolean {
  let point = -1;
  for (let i = 0; i < t.length; i++) {
    const c = t.charCodeAt(i);
    if (c === 46) {
      if (point !== -1 || i === 0 || i === t.length - 1) return false;
      point = i;
    } else if (c < 48 || c > 57) return false;
  }
  return true;
}

/** Parses a number cell: thousands separators per the format, surrounding spaces ignored, nothing else. */
export function parseNumber(text: string, format: NumberFormat = {}): ParsedNumber {
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, message: 'is empty' };
  const decimalComma = format.decimalComma === true;
  if (!decimalComma && isPlainDecimal(trimmed)) return { ok: true, value: Number(trimmed) };
  if (!(decimalComma ? commaStyle : pointStyle).test(trimmed)) {
    const hint =
      !decimalComma && /^[+-]?\d+,\d{1,2}$/.test(trimmed)
        ? ' (looks like a decimal comma; set the mapping to decimal comma if the file uses 1.234,5 style numbers)'
        : '';
    return { ok: false, message: `"${trimmed}" is not a number${hint}` };
  }
  const canonical = decimalComma ? trimmed.replace(/\./g, '').replace(',', '.') : trimmed.replace(/,/g, '');
  return { ok: true, value: Number(canonical) };
}

/** A volume or register value: a number that is not negative. */
export function parseVolume(text: string, format: NumberFormat = {}): ParsedNumber {
  const parsed = parseNumber(text, format);
  if (!parsed.ok) return parsed;
  if (parsed.value < 0) return { ok: false, message: `${text.trim()} is negative; a volume cannot be below zero` };
  return parsed;
}
