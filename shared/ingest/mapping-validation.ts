/** Checks a column mapping (guessed or edited by a person) before any row is read. */
import { VOLUME_UNITS } from '../units/volume-units';
import { FIELD_LABELS, INTERVAL_MINUTES, type ColumnMapping, type MappedField } from './upload-kind';

export interface MappingProblem {
  field: MappedField | 'intervalColumns';
  message: string;
}

/** Wide rows: 24 hourly, 96 quarter-hourly or 48 half-hourly columns; the DST-day variants are allowed too. */
export const WIDE_COLUMN_COUNTS = [23, 24, 25, 46, 48, 50, 92, 96, 100] as const;

function required(field: MappedField, why = ''): MappingProblem {
  return { field, message: `Choose the ${FIELD_LABELS[field]} column${why}.` };
}

/** Every problem with the mapping; an empty list means rows can be read. */
export function validateMapping(mapping: ColumnMapping): MappingProblem[] {
  const problems: MappingProblem[] = [];
  const c = mapping.columns;
  const has = (field: MappedField) => c[field] !== undefined;

  for (const [field, index] of Object.entries(c) as Array<[MappedField, number]>) {
    if (!Number.isInteger(index) || index < 0 || index >= mapping.header.length) {
      problems.push({ field, message: `The ${FIELD_LABELS[field]} column (${index + 1}) is not in the header.` });
    }
  }
  const used = new Map<number, MappedField>();
  for (const [field, index] of Object.entries(c) as Array<[MappedField, number]>) {
    const other = used.get(index);
    if (other)
      problems.push({ field, message: `"${mapping.header[index]}" is already the ${FIELD_LABELS[other]} column.` });
    used.set(index, field);
  }

  const needsMeter = () => {
    if (!has('meter') && !mapping.fixedMeterRef?.trim())
      problems.push(required('meter', ', or choose the meter for a single-meter file'));
  };
  // Without a unit column or a chosen unit, each meter's own unit is used.
  const needsUnit = () => {
    if (mapping.unit && !(VOLUME_UNITS as readonly string[]).includes(mapping.unit)) {
      problems.push({ field: 'unit', message: `Unknown unit "${mapping.unit}".` });
    }
  };
  const needsTimestamp = () => {
    if (has('time') && !has('date')) problems.push(required('date', ' to go with the time column'));
    else if (!has('timestamp') && !has('date')) problems.push(required('timestamp'));
  };

  switch (mapping.kind) {
    case 'interval-long':
      needsMeter();
      needsTimestamp();
      if (!has('value')) problems.push(required('value'));
      needsUnit();
      if (!has('intervalMinutes')) {
        if (mapping.intervalMinutes === undefined)
          problems.push(required('intervalMinutes', ', or choose the interval length'));
        else if (!(INTERVAL_MINUTES as readonly number[]).includes(mapping.intervalMinutes)) {
          problems.push({
            field: 'intervalMinutes',
            message: `Interval length must be one of ${INTERVAL_MINUTES.join(', ')} minutes.`,
          });
        }
      }
      break;
    case 'interval-wide': {
      needsMeter();
      if (!has('date')) problems.push(required('date'));
      needsUnit();
      const run = mapping.intervalColumns;
      if (!run || !(WIDE_COLUMN_COUNTS as readonly number[]).includes(run.count)) {
        problems.push({
          field: 'intervalColumns',
          message: `A one-row-per-day file needs 24, 48 or 96 interval columns${run ? `; found ${run.count}` : ''}.`,
        });
      } else if (run.first < 0 || run.first + run.count > mapping.header.length) {
        problems.push({ field: 'intervalColumns', message: 'The interval columns run past the end of the header.' });
      }
      break;
    }
    case 'register':
      needsMeter();
      needsTimestamp();
      if (!has('value')) problems.push(required('value'));
      needsUnit();
      break;
    case 'billing':
      needsMeter();
      if (!has('start')) problems.push({ field: 'start', message: "Choose the column with each period's first day." });
      if (!has('end')) problems.push({ field: 'end', message: "Choose the column with each period's last day." });
      if (!has('value')) problems.push(required('value'));
      needsUnit();
      break;
    case 'runtime':
      if (!has('controller')) problems.push(required('controller'));
      if (!has('station')) problems.push(required('station'));
      if (!has('start')) problems.push(required('start'));
      if (!has('duration') && !has('end'))
        problems.push({ field: 'duration', message: 'Choose the run time column or the run end column.' });
      break;
  }
  return problems;
}
