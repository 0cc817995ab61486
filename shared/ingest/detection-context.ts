/** What every layout detector works from: the header's roles, the sample rows, and the mapping being built. */
import type { DateOrder } from './date-order';
import type { Delimiter } from './delimiter-sniffing';
import { classifyHeader, isSerialHeader, unitFromText, type HeaderRole } from './header-vocabulary';
import { combineDateAndTime, parseTimeOfDay, parseTimestamp } from './timestamp-parsing';
import { INTERVAL_MINUTES, type ColumnMapping, type MappedField, type UploadKind } from './upload-kind';
import { wallTimeAsUtcMs } from './zoned-time';

export interface DetectionOptions {
  /** The file's delimiter; decimal commas are only considered when it is not `,`. */
  delimiter?: Delimiter;
  /** How numeric dates are read while looking at the samples (month-first when not known). */
  dateOrder?: DateOrder;
}

export class DetectionContext {
  readonly roles: HeaderRole[];
  readonly reasons: string[] = [];
  /** Each doubt lowers the confidence by a fifth. */
  doubts = 0;
  mapping!: ColumnMapping;

  constructor(
    readonly header: string[],
    readonly sample: string[][],
    readonly options: DetectionOptions,
  ) {
    this.roles = header.map(classifyHeader);
  }

  /** Starts the mapping for the chosen kind. */
  begin(kind: UploadKind): ColumnMapping {
    this.mapping = { kind, header: [...this.header], columns: {} };
    return this.mapping;
  }

  first(role: HeaderRole): number | undefined {
    const i = this.roles.indexOf(role);
    return i < 0 ? undefined : i;
  }

  has(role: HeaderRole): boolean {
    return this.first(role) !== undefined;
  }

  /** Maps `field` to column `index` unless the column is taken; says so in the reasons. */
  take(field: MappedField, index: number | undefined): void {
    const columns = this.mapping.columns;
    if (index === undefined || Object.values(columns).includes(index)) return;
    columns[field] = index;
    this.reasons.push(`"${this.header[index]}" → ${field}.`);
  }

  /** The non-empty sample cells of one column. */
  cells(index: number | undefined): string[] {
    if (index === undefined) return [];
    return this.sample.map((r) => (r[index] ?? '').trim()).filter((v) => v !== '');
  }

  parse(text: string) {
    return parseTimestamp(text, this.options.dateOrder);
  }

  /** True when most sample cells are a time of day only (e.g. a "Start" column beside a "Date" column). */
  looksTimeOnly(index: number | undefined): boolean {
    const values = this.cells(index);
    return values.length > 0 && values.filter((v) => parseTimeOfDay(v).ok).length * 2 > values.length;
  }

  /** The meter column; with two meter-like columns, the one that is not the physical serial. */
  meterColumns(): { meter?: number; serial?: number } {
    const meterLike = this.roles.flatMap((r, i) => (r === 'meter' ? [i] : []));
    if (meterLike.length < 2) return { meter: meterLike[0] };
    const serial = meterLike.find((i) => isSerialHeader(this.header[i] ?? ''));
    return { meter: meterLike.find((i) => i !== serial), serial };
  }

  /** Most common positive spacing (minutes) between consecutive sample timestamps of the same meter. */
  sampleSpacingMinutes(): number | undefined {
    const columns = this.mapping.columns;
    const last = new Map<string, number>();
    const counts = new Map<number, number>();
    for (const row of this.sample) {
      const cell = (i: number | undefined) => (i === undefined ? '' : (row[i] ?? ''));
      const parsed =
        columns.timestamp !== undefined
          ? this.parse(cell(columns.timestamp))
          : combineDateAndTime(cell(columns.date), cell(columns.time), this.options.dateOrder);
      if (!parsed.ok) continue;
      const ms = parsed.kind === 'instant' ? parsed.utcMs : wallTimeAsUtcMs(parsed.wall);
      const key = columns.meter === undefined ? '' : (row[columns.meter] ?? '').trim();
      const prev = last.get(key);
      last.set(key, ms);
      if (prev === undefined || ms <= prev) continue;
      const minutes = Math.round((ms - prev) / 60_000);
      counts.set(minutes, (counts.get(minutes) ?? 0) + 1);
    }
    const best = [...counts.entries()].sort((a, b) => b[1] - a[1])[0]?.[0];
    return best !== undefined && (INTERVAL_MINUTES as readonly number[]).includes(best) ? best : undefined;
  }

  /** The unit: a unit column, else one named in the value's (or any non-slot) header, else each meter's own. */
  detectUnit(): void {
    this.take('unit', this.first('unit'));
    const columns = this.mapping.columns;
    if (columns.unit !== undefined) return;
    const sources =
      columns.value !== undefined
        ? [columns.value]
        : this.header.map((_, i) => i).filter((i) => this.roles[i] !== 'interval-slot');
    for (const i of sources) {
      const unit = unitFromText(this.header[i] ?? '');
      if (unit) {
        this.mapping.unit = unit;
        this.reasons.push(`Unit ${unit}, named in "${this.header[i]}".`);
        return;
      }
    }
    this.reasons.push("No unit in the file: each meter's own unit is used.");
  }

  /** Meter column (and the serial, when a register file names both), or a single-meter file. */
  detectMeter(withSerial = false): void {
    const { meter, serial } = this.meterColumns();
    this.take('meter', meter);
    if (withSerial) this.take('serial', serial);
    if (this.mapping.columns.meter === undefined) {
      this.reasons.push('No meter column: a single-meter file; choose the meter.');
      this.doubts++;
    }
  }
}
