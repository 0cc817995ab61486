import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { Config } from '../../backend/src/config';
import { FieldAuditEntity } from '../../backend/src/components/field-audits/data/field-audit.entity';
import { FieldAuditFaultEntity } from '../../backend/src/components/field-audits/data/field-audit-fault.entity';
import { FieldAuditPhotoEntity } from '../../backend/src/components/field-audits/data/field-audit-photo.entity';
import { FieldAuditZoneTestEntity } from '../../backend/src/components/field-audits/data/field-audit-zone-test.entity';
import { HydrozoneEntity } from '../../backend/src/components/hydrozones/data/hydrozone.entity';
import { OrganisationEntity } from '../../backend/src/components/organisations/data/organisation.entity';
import { WhatIfPlanEntity } from '../../backend/src/components/planner/data/what-if-plan.entity';
import { SavingsProjectEntity } from '../../backend/src/components/savings/data/savings-project.entity';
import { SiteEntity } from '../../backend/src/components/sites/data/site.entity';
import { UserEntity } from '../../backend/src/components/users/data/user.entity';
import { LocalFileStore } from '../../backend/src/platform/storage/local-file-store';
import { DEMO_AUDIT, DEMO_AUDIT_SITE, DEMO_FAULTS, DEMO_PLANS, DEMO_ZONE_TESTS } from './demo-field-work';
import { demoPhotoPng } from './demo-photo';
import { DEMO_ORGANISATIONS, DEMO_USERS } from './demo-scenario';

/**
 * The demo's audit (by the contractor cooperative, with invented photos kept in the upload store) and plans, one
 * carried out into the existing savings project. Idempotent: matched by site and title. Runs after seedSavings.
 */
export async function seedFieldWork(db: DataSource, config: Config): Promise<{ audits: number; plans: number }> {
  const orgId = async (key: string) =>
    (
      await db
        .getRepository(OrganisationEntity)
        .findOneByOrFail({ name: DEMO_ORGANISATIONS.find((o) => o.key === key)!.name })
    ).id;
  const cobalt = await orgId('cobalt');
  const contractorEmail = DEMO_USERS.find((u) => u.organisation === 'thistlewood' && u.role === 'contractor')!.email;
  const contractor = await db.getRepository(UserEntity).findOneByOrFail({ email: contractorEmail });
  const site = async (name: string) => db.getRepository(SiteEntity).findOneByOrFail({ organisationId: cobalt, name });
  const zoneId = async (siteId: number, name: string) =>
    (await db.getRepository(HydrozoneEntity).findOneByOrFail({ siteId, name })).id;

  let audits = 0;
  const auditSite = await site(DEMO_AUDIT_SITE);
  if (!(await db.getRepository(FieldAuditEntity).findOneBy({ siteId: auditSite.id, title: DEMO_AUDIT.title }))) {
    await seedAudit(
      db,
      config,
      { siteId: auditSite.id, organisationId: await orgId('thistlewood'), userId: contractor.id },
      zoneId,
    );
    audits = 1;
  }
  let plans = 0;
  for (const p of DEMO_PLANS) {
    const s = await site(p.site);
    if (await db.getRepository(WhatIfPlanEntity).findOneBy({ siteId: s.id, title: p.title })) continue;
    const project = p.carriedOut
      ? await db
          .getRepository(SavingsProjectEntity)
          .findOneBy({ siteId: s.id, title: p.carriedOut.savingsProjectTitle })
      : null;
    const changes = [];
    for (const { zone, ...change } of p.changes) changes.push({ hydrozoneId: await zoneId(s.id, zone), ...change });
    await db.getRepository(WhatIfPlanEntity).insert({
      siteId: s.id,
      title: p.title,
      notes: p.notes,
      weatherYear: p.weatherYear,
      costOfWork: p.costOfWork,
      currency: 'USD',
      smartControllerPercent: p.smartControllerReductionPercent,
      rainSensor: p.rainSensor,
      zoneChanges: JSON.stringify(changes),
      status: project ? 'carried-out' : 'draft',
      savingsProjectId: project?.id ?? null,
      carriedOutOn: project ? p.carriedOut!.on : null,
      createdBy: contractor.id,
    });
    plans++;
  }
  return { audits, plans };
}

async function seedAudit(
  db: DataSource,
  config: Config,
  who: { siteId: number; organisationId: number; userId: number },
  zoneId: (siteId: number, name: string) => Promise<number>,
): Promise<void> {
  const store = new LocalFileStore(config.uploads.dir);
  const keys: string[] = [];
  for (let i = 0; i < DEMO_FAULTS.length; i++) {
    if (!DEMO_FAULTS[i]!.photos) continue;
    const bytes = demoPhotoPng(i + 1);
    const pending = store.begin();
    await pending.write(bytes);
    keys[i] = await pending.keep(createHash('sha256').update(bytes).digest('hex'));
  }
  await db.transaction(async (em) => {
    const { identifiers } = await em.getRepository(FieldAuditEntity).insert({
      siteId: who.siteId,
      organisationId: who.organisationId,
      createdBy: who.userId,
      ...DEMO_AUDIT,
      notes: DEMO_AUDIT.notes ?? '',
    });
    const auditId = Number(identifiers[0]!['id']);
    const testIds = new Map<string, number>();
    for (const { zone, ...t } of DEMO_ZONE_TESTS) {
      const hydrozoneId = await zoneId(who.siteId, zone);
      const area = (await em.getRepository(HydrozoneEntity).findOneByOrFail({ id: hydrozoneId })).areaFt2;
      const result = await em.getRepository(FieldAuditZoneTestEntity).insert({
        auditId,
        hydrozoneId,
        hydrozoneName: zone,
        hydrozoneAreaFt2: area,
        headType: t.headType,
        runMinutes: t.runMinutes,
        catchUnit: t.catchUnit,
        throatDiameter: t.throatDiameter ?? null,
        throatUnit: t.throatUnit ?? null,
        catches: JSON.stringify(t.catches),
        pressures: JSON.stringify(t.pressures ?? []),
        soilIntakeInPerHour: t.soilIntakeInPerHour ?? null,
        slopePercent: t.slopePercent ?? null,
        notes: t.notes ?? '',
      });
      testIds.set(zone, Number(result.identifiers[0]!['id']));
    }
    for (const [i, { zone, photos, ...f }] of DEMO_FAULTS.entries()) {
      const fault = await em.getRepository(FieldAuditFaultEntity).insert({
        auditId,
        zoneTestId: zone ? (testIds.get(zone) ?? null) : null,
        kind: f.kind,
        location: f.location,
        description: f.description ?? '',
        status: f.status ?? 'open',
      });
      if (!photos) continue;
      await em.getRepository(FieldAuditPhotoEntity).insert({
        faultId: Number(fault.identifiers[0]!['id']),
        storageKey: keys[i]!,
        contentType: 'image/png',
        sizeBytes: demoPhotoPng(i + 1).length,
        createdBy: who.userId,
      });
    }
  });
}
