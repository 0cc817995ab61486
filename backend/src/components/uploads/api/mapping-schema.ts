import { z } from 'zod';
import { DATE_ORDERS } from '@shared/ingest/date-order';
import { MAPPED_FIELDS, UPLOAD_KINDS, type MappedField } from '@shared/ingest/upload-kind';
import { VOLUME_UNITS } from '@shared/units/volume-units';

const columnIndex = z.number().int().min(0).max(10_000);
const columns = z
  .partialRecord(z.enum(MAPPED_FIELDS), columnIndex)
  .transform((c) => c as Partial<Record<MappedField, number>>);

const optionalFields = {
  intervalColumns: z.strictObject({ first: columnIndex, count: z.number().int().min(1).max(200) }).optional(),
  unit: z.enum(VOLUME_UNITS).optional(),
  intervalMinutes: z.number().int().positive().optional(),
  fixedMeterRef: z.string().trim().max(64).optional(),
  decimalComma: z.boolean().optional(),
  timestampMarksEnd: z.boolean().optional(),
};

/**
 * A whole ColumnMapping as the upload page (or a saved profile) sends it; the header is re-read from the file.
 * Its `dateOrder` is a chosen day/month order (the upload's own `dateOrder` field wins when both are given).
 */
export const mappingSchema = z.strictObject({
  kind: z.enum(UPLOAD_KINDS),
  header: z.array(z.string().max(500)).max(10_000).default([]),
  columns,
  ...optionalFields,
  dateOrder: z.enum(DATE_ORDERS).optional(),
});

/** Changes applied on top of the detected mapping, e.g. `{ "fixedMeterRef": "SCHOOL-02" }`. */
export const overridesSchema = z.strictObject({ columns: columns.optional(), ...optionalFields });
