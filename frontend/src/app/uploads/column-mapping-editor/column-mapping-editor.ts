import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';
import {
  FIELD_LABELS,
  INTERVAL_MINUTES,
  UPLOAD_KINDS,
  type ColumnMapping,
  type MappedField,
  type UploadKind,
} from '@shared/ingest/upload-kind';
import { VOLUME_UNIT_LABELS, VOLUME_UNITS, type VolumeUnit } from '@shared/units/volume-units';

/** The columns a person may point at, per kind of file. */
const FIELDS_BY_KIND: Record<UploadKind, MappedField[]> = {
  'interval-long': ['meter', 'timestamp', 'date', 'time', 'value', 'unit', 'intervalMinutes', 'readType'],
  'interval-wide': ['meter', 'date', 'unit'],
  register: [
    'meter',
    'serial',
    'timestamp',
    'date',
    'time',
    'value',
    'unit',
    'multiplier',
    'registerDigits',
    'readType',
  ],
  runtime: ['controller', 'station', 'start', 'date', 'end', 'duration', 'cause', 'measuredGallons'],
  billing: ['meter', 'start', 'end', 'value', 'unit', 'readType'],
};

export const KIND_LABELS: Record<UploadKind, string> = {
  'interval-long': 'Interval readings, one per row',
  'interval-wide': 'Interval readings, one day per row',
  register: 'Register reads (cumulative)',
  runtime: 'Controller run log',
  billing: 'Billing periods (start, end, usage)',
};

/** Shows the detected column for each field and lets a person point any field at another column (or none). */
@Component({
  selector: 'rm-column-mapping-editor',
  imports: [MatFormFieldModule, MatSelectModule],
  templateUrl: './column-mapping-editor.html',
  styleUrl: './column-mapping-editor.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ColumnMappingEditor {
  readonly mapping = input.required<ColumnMapping>();
  /** Meter refs of the site, for single-meter files. */
  readonly meterRefs = input<string[]>([]);
  readonly mappingChange = output<ColumnMapping>();

  protected readonly kinds = UPLOAD_KINDS;
  protected readonly kindLabels = KIND_LABELS;
  protected readonly labels = FIELD_LABELS;
  protected readonly units = VOLUME_UNITS;
  protected readonly unitLabels = VOLUME_UNIT_LABELS;
  protected readonly intervals = INTERVAL_MINUTES;
  protected readonly fields = computed(() => FIELDS_BY_KIND[this.mapping().kind]);
  protected readonly header = computed(() => this.mapping().header);
  protected readonly needsMeter = computed(
    () => this.mapping().kind !== 'runtime' && this.mapping().columns.meter === undefined,
  );
  protected readonly needsUnit = computed(
    () => this.mapping().kind !== 'runtime' && this.mapping().columns.unit === undefined,
  );
  protected readonly needsInterval = computed(
    () => this.mapping().kind === 'interval-long' && this.mapping().columns.intervalMinutes === undefined,
  );

  protected columnOf(field: MappedField): number | null {
    return this.mapping().columns[field] ?? null;
  }

  protected chooseColumn(field: MappedField, index: number | null): void {
    const columns = { ...this.mapping().columns };
    // One column feeds one field: taking it here frees it elsewhere.
    for (const [other, i] of Object.entries(columns) as Array<[MappedField, number]>)
      if (i === index) delete columns[other];
    if (index === null) delete columns[field];
    else columns[field] = index;
    this.mappingChange.emit({ ...this.mapping(), columns });
  }

  protected chooseKind(kind: UploadKind): void {
    this.mappingChange.emit({ ...this.mapping(), kind });
  }

  protected chooseUnit(unit: VolumeUnit | null): void {
    this.mappingChange.emit({ ...this.mapping(), unit: unit ?? undefined });
  }

  protected chooseInterval(minutes: number | null): void {
    this.mappingChange.emit({ ...this.mapping(), intervalMinutes: minutes ?? undefined });
  }

  protected chooseMeter(ref: string | null): void {
    this.mappingChange.emit({ ...this.mapping(), fixedMeterRef: ref ?? undefined });
  }
}
