/**
 * The four tables an upload writes, described once so staging, duplicate/conflict classification, replacing
 * and roll-back are the same SQL for each. `key` is the table's primary key; `compared` decides duplicate
 * (all equal) versus conflict; `copied` are the columns written besides the key.
 */
export interface IngestTarget {
  table: 'meter_reading' | 'runtime_event' | 'meter_register_read' | 'meter_billing_period';
  /** What each row belongs to: a meter or a controller's zone (the first key column). */
  owner: 'meter_id' | 'zone_id';
  /** Stage column definitions, in the order the stage lines carry them (row_no is added last). */
  stageColumns: Array<[name: string, type: string]>;
  key: string[];
  compared: string[];
  copied: string[];
  /** The value summed when a person chooses to add up a reading the file gives twice (interval volumes only). */
  summable?: { gallons: string; original: string; unit: string };
}

export const INTERVAL_TARGET: IngestTarget = {
  table: 'meter_reading',
  owner: 'meter_id',
  stageColumns: [
    ['meter_id', 'int unsigned NOT NULL'],
    ['start_utc', 'datetime NOT NULL'],
    ['minutes', 'mediumint unsigned NOT NULL'],
    ['volume_gal', 'decimal(12,4) NOT NULL'],
    ['original_value', 'decimal(16,6) NOT NULL'],
    ['original_unit', `varchar(8) NOT NULL`],
    ['flags', 'tinyint unsigned NOT NULL'],
  ],
  key: ['meter_id', 'start_utc', 'minutes'],
  compared: ['volume_gal'],
  copied: ['volume_gal', 'original_value', 'original_unit', 'flags'],
  summable: { gallons: 'volume_gal', original: 'original_value', unit: 'original_unit' },
};

export const RUNTIME_TARGET: IngestTarget = {
  table: 'runtime_event',
  owner: 'zone_id',
  stageColumns: [
    ['zone_id', 'int unsigned NOT NULL'],
    ['start_utc', 'datetime NOT NULL'],
    ['minutes', 'smallint unsigned NOT NULL'],
    ['cause', 'varchar(16) NULL'],
    ['measured_gallons', 'decimal(12,2) NULL'],
  ],
  key: ['zone_id', 'start_utc'],
  compared: ['minutes', 'cause', 'measured_gallons'],
  copied: ['minutes', 'cause', 'measured_gallons'],
};

export const REGISTER_TARGET: IngestTarget = {
  table: 'meter_register_read',
  owner: 'meter_id',
  stageColumns: [
    ['meter_id', 'int unsigned NOT NULL'],
    ['read_at', 'datetime NOT NULL'],
    ['position', 'tinyint unsigned NOT NULL'],
    ['register_value', 'decimal(16,4) NOT NULL'],
    ['unit', 'varchar(8) NOT NULL'],
    ['serial', 'varchar(64) NULL'],
    ['multiplier', 'double NULL'],
    ['digits', 'tinyint unsigned NULL'],
    ['estimated', 'tinyint unsigned NOT NULL'],
  ],
  key: ['meter_id', 'read_at', 'position'],
  compared: ['register_value'],
  copied: ['register_value', 'unit', 'serial', 'multiplier', 'digits', 'estimated'],
};

export const BILLING_TARGET: IngestTarget = {
  table: 'meter_billing_period',
  owner: 'meter_id',
  stageColumns: [
    ['meter_id', 'int unsigned NOT NULL'],
    ['start_date', 'date NOT NULL'],
    ['end_date', 'date NOT NULL'],
    ['volume_gal', 'decimal(14,4) NOT NULL'],
    ['original_value', 'decimal(16,6) NOT NULL'],
    ['original_unit', 'varchar(8) NOT NULL'],
    ['estimated', 'tinyint unsigned NOT NULL'],
  ],
  key: ['meter_id', 'start_date'],
  compared: ['end_date', 'volume_gal'],
  copied: ['end_date', 'volume_gal', 'original_value', 'original_unit', 'estimated'],
};

export const ALL_TARGETS = [INTERVAL_TARGET, RUNTIME_TARGET, REGISTER_TARGET, BILLING_TARGET];

/** `2026-11-01T08:00:00.000Z` → `2026-11-01 08:00:00` (what a DATETIME column takes, in UTC). */
export function sqlUtc(iso: string): string {
  let sql = sqlTimes.get(iso);
  if (sql === undefined) {
    if (sqlTimes.size > 100_000) sqlTimes.clear();
    sql = `${iso.slice(0, 10)} ${iso.slice(11, 19)}`;
    sqlTimes.set(iso, sql);
  }
  return sql;
}

/** Remembered conversions: the readers hand out the same ISO strings again and again (see `toIso`). */
const sqlTimes = new Map<string, string>();
