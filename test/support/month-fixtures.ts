/** Fixtures for the role-month tests: a site with a budget, metered use, a rate and an alert in a chosen month. */
import type { DataSource } from 'typeorm';
import { daysIn, insertMonthlyUse, monthEto, monthsBetween, weatherForSite } from './report-fixtures';
import { createSite, type Client } from './test-app';

export async function budgetedSite(
  db: DataSource,
  manager: Client,
  organisationId: number,
  opts: { name: string; month: string; useGallons: number | null; meteredDays?: number },
): Promise<number> {
  const site = await createSite(db, organisationId, { name: opts.name });
  await weatherForSite(manager, site.id, `${opts.month}-01`, `${opts.month}-${daysIn(opts.month)}`);
  await manager
    .post(`/api/sites/${site.id}/hydrozones`, {
      name: 'Turf bowl',
      area: 8000,
      areaUnit: 'ft2',
      plantFactor: 0.7,
      irrigationMethod: 'spray',
    })
    .expect(201);
  await manager
    .post(`/api/sites/${site.id}/rate-schedules`, {
      name: 'Landscape rate',
      unit: 'kgal',
      fixedChargePerPeriod: 10,
      volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
      effectiveFrom: '2020-01-01',
    })
    .expect(201);
  if (opts.useGallons !== null) await insertMonthlyUse(db, site.id, opts.month, opts.useGallons, opts.meteredDays);
  return site.id;
}

/** A leak alert on the site from day 10 to day 12 of the month (UTC noon to noon), as the watch would file it. */
export async function alertInMonth(
  db: DataSource,
  siteId: number,
  month: string,
  waterLostGal = 1500,
): Promise<number> {
  const start = new Date(`${month}-10T12:00:00Z`);
  const end = new Date(`${month}-12T12:00:00Z`);
  const key = `test-leak-${siteId}-${month}`;
  const result: { insertId: number } = await db.query(
    `INSERT INTO alert (site_id, kind, sub_kind, finding_key, condition_key, period_start_utc, period_end_utc,
      severity, status, ongoing, evidence, water_lost_gal, explanation, first_detected_at, last_seen_at)
     VALUES (?, 'leak', 'continuous-flow', ?, ?, ?, ?, 'act-soon', 'open', 0, ?, ?, 'Flow never stopped.', ?, ?)`,
    [
      siteId,
      key,
      key,
      start,
      end,
      JSON.stringify({ numbers: {}, series: [], suspectZoneIds: [], detectedAtUtc: end.toISOString() }),
      waterLostGal,
      end,
      end,
    ],
  );
  return result.insertId;
}

/**
 * A site whose truth is known for savings: baseline use = 3,000 gal + 800 gal/mm × monthly ETo (± 2 %) over 2024,
 * reporting use 70 % of that from 2025-02 to 2025-09, priced at $4/kgal.
 */
export async function siteWithSavings(
  db: DataSource,
  manager: Client,
  organisationId: number,
  name: string,
): Promise<number> {
  const site = await createSite(db, organisationId, { name });
  await weatherForSite(manager, site.id, '2024-01-01', '2025-09-30');
  const trueUse = (month: string) => 3000 + 800 * monthEto(month);
  const noise = [0.02, -0.015, 0.01, -0.02, 0.005, 0.015, -0.01, -0.005, 0.02, -0.02, 0.01, -0.01];
  for (const [i, m] of monthsBetween('2024-01', '2024-12').entries())
    await insertMonthlyUse(db, site.id, m, trueUse(m) * (1 + noise[i]!));
  for (const m of monthsBetween('2025-02', '2025-09')) await insertMonthlyUse(db, site.id, m, 0.7 * trueUse(m));
  await manager
    .post(`/api/sites/${site.id}/rate-schedules`, {
      name: 'Landscape rate',
      unit: 'kgal',
      fixedChargePerPeriod: 10,
      volumeCharge: { kind: 'uniform', pricePerUnit: 4 },
      effectiveFrom: '2024-01-01',
    })
    .expect(201);
  return site.id;
}

export const SAVINGS_PROJECT = {
  title: 'Slope drip retrofit',
  changeKind: 'spray-to-drip',
  changeDescription: 'Spray heads on the slope replaced by inline drip.',
  retrofits: ['Zones 3–5: 84 spray heads capped, inline drip under mulch', 'Pressure regulator at each valve'],
  installedCost: 1200,
  costCurrency: 'USD',
  installedOn: '2025-01-15',
  baselineFrom: '2024-01',
  baselineTo: '2024-12',
  reportingFrom: '2025-02',
  reportingTo: '2025-09',
  modelForm: 'eto',
};
