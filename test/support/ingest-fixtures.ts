import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import type { DataSource } from 'typeorm';
import type { Client } from './test-app';

export const SAMPLES = resolve(import.meta.dirname, '../../samples');

export interface CatalogueMeter {
  ref: string;
  unit: string;
  registerDigits?: number;
  multiplier?: number;
  registers?: Array<{ installedUtc: string; removedUtc: string | null; multiplier: number; digits: number }>;
}
export interface CatalogueSite {
  name: string;
  timeZone: string;
  meters: CatalogueMeter[];
  controllers: string[];
}
export interface CatalogueFile {
  timeZone: string;
  kind?: string | null;
  records?: number;
  errors?: number;
  errorAt?: Array<[number, number]>;
  refused?: string;
  fileProblem?: string;
  mappingProblems?: string[];
  mappingOverrides?: Record<string, unknown>;
  checkKnownRefs?: boolean;
  /** The day/month order a person chooses for a file whose dates fit both. */
  dateOrder?: 'month-first' | 'day-first';
  differenced?: { volumes: number; rollovers: number; problems: string[] };
  /** A file for the organisation-wide upload (rows of several sites). */
  organisation?: boolean;
  unknownRefs?: string[];
}

export const catalogue = JSON.parse(readFileSync(resolve(SAMPLES, 'catalogue.json'), 'utf8')) as {
  now: string;
  sites: CatalogueSite[];
  files: Record<string, CatalogueFile>;
};

/** Per file and meter: readings (register files: volumes; bills: periods) and US gallons, summed by make-samples.py. */
export const expectedTotals = (
  JSON.parse(readFileSync(resolve(SAMPLES, 'expected-totals.json'), 'utf8')) as {
    files: Record<string, Record<string, { records: number; gallons: number }>>;
  }
).files;

/** Stations the sample runtime logs use, per controller. */
export const SAMPLE_STATIONS: Record<string, string[]> = {
  'CTL-HOA-NORTH-A': ['1', '2', '3', '4'],
  'CTL-OFFICE-A': ['1', '2', '3', '4'],
  'CTL-SCHOOL-A': ['A1', 'A2', 'A3', 'B1'],
};

/** The meter body the API takes, from a catalogue meter (the last register is the current one). */
export function meterBody(m: CatalogueMeter) {
  const registers = m.registers ?? [];
  const current = registers.at(-1);
  return {
    ref: m.ref,
    unit: m.unit,
    registerMultiplier: current?.multiplier ?? m.multiplier ?? 1,
    registerDigits: current?.digits ?? m.registerDigits ?? null,
    purpose: 'dedicated-irrigation',
    waterSource: 'potable',
    installedAt: current?.installedUtc ?? '2020-01-01T00:00:00.000Z',
    removedAt: null,
    previousRegisters: registers.slice(0, -1).map((r) => ({
      installedAt: r.installedUtc,
      removedAt: r.removedUtc!,
      multiplier: r.multiplier,
      digits: r.digits,
    })),
  };
}

/** Every catalogue meter and controller (with the stations the samples use) on one site, through the API. */
export async function equipSite(client: Client, siteId: number): Promise<void> {
  for (const site of catalogue.sites) {
    for (const m of site.meters) {
      const res = await client.post(`/api/sites/${siteId}/meters`, meterBody(m));
      if (res.status !== 201) throw new Error(`meter ${m.ref}: ${res.status} ${JSON.stringify(res.body)}`);
    }
    for (const ref of site.controllers) {
      const zones = SAMPLE_STATIONS[ref]!.map((station) => ({ station, name: `Station ${station}` }));
      const res = await client.post(`/api/sites/${siteId}/controllers`, { ref, name: `Controller ${ref}`, zones });
      if (res.status !== 201) throw new Error(`controller ${ref}: ${res.status} ${JSON.stringify(res.body)}`);
    }
  }
}

/** Sends one sample file (or a Buffer) as the browser and curl do. */
export function uploadFile(
  client: Client,
  siteId: number,
  file: string | Buffer,
  fields: Record<string, string> = {},
  name = 'upload.csv',
) {
  const req = client.multipart(`/api/sites/${siteId}/uploads`);
  for (const [key, value] of Object.entries(fields)) req.field(key, value);
  return typeof file === 'string' ? req.attach('file', resolve(SAMPLES, file)) : req.attach('file', file, name);
}

/** Stored interval readings of a site, in key order, for before/after comparisons. */
export async function siteReadings(
  db: DataSource,
  siteId: number,
): Promise<Array<{ ref: string; start: string; minutes: number; gallons: string; uploadId: number }>> {
  const rows = await db.query(
    `SELECT m.ref, r.start_utc, r.minutes, r.volume_gal, r.upload_id FROM meter_reading r JOIN
      meter m ON m.id = r.meter_id
     WHERE m.site_id = ? ORDER BY m.ref, r.start_utc, r.minutes`,
    [siteId],
  );
  return rows.map((r: Record<string, unknown>) => ({
    ref: String(r['ref']),
    start: new Date(r['start_utc'] as string).toISOString(),
    minutes: Number(r['minutes']),
    gallons: String(r['volume_gal']),
    uploadId: Number(r['upload_id']),
  }));
}

export async function siteRuns(db: DataSource, siteId: number): Promise<number> {
  const [row] = await db.query(
    `SELECT COUNT(*) AS n FROM runtime_event e JOIN zone z ON z.id = e.zone_id JOIN controller c ON
      c.id = z.controller_id WHERE c.site_id = ?`,
    [siteId],
  );
  return Number(row.n);
}
